import { expect } from 'chai';
import request from 'supertest';
import type {
  DesignDraft,
  Project,
  ProjectRecheck,
  RevisionComparison,
  SystemCurveResponse,
} from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { Pump, Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { designPipeSystem } from '../../../shared/api/design-system';
import { createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { importText } from '../../data-import/catalog-fixtures';

/** One invented pump with head to spare for a falls 3 m up. */
const curveTable = [
  'riffle-curve-table,1',
  'flow-unit,m3/h',
  'head-unit,m',
  'efficiency-unit,%',
  'model_code,display_name,kind,preferred_flow_min,preferred_flow_max,flow,head,efficiency',
  'H-30,Heron test pump 30,external-centrifugal,10,20,0,12.0,0',
  'H-30,,,,,5,11.5,35',
  'H-30,,,,,10,10.4,52',
  'H-30,,,,,15,8.6,60',
  'H-30,,,,,20,6.1,55',
  'H-30,,,,,25,2.8,40',
].join('\n');

const units = { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' } as const;

const search: DesignDraft['search'] = {
  arrangements: [1],
  requireOneFailed: false,
  standby: false,
  onlyPreferredRegion: false,
  maxInputPowerPerPump: null,
  hoursPerDay: 24,
  tariffPerKWh: null,
  limit: 20,
};

/** A design saved before branches and suction sides existed: 4 m through 30 m of 2-inch pipe. */
function singleRoute(): DesignDraft {
  return {
    unitSystem: 'si',
    system: {
      staticMode: 'direct',
      staticHead: 4,
      intakeLevel: 0,
      dischargeLevel: 4,
      outletPressureHead: 0,
      waterTemperatureC: 20,
      frictionMethod: 'hazen-williams',
      segments: [
        { series: 'pvc-sch40', size: 'pvc-sch40-2', length: 30, fittings: [{ kind: 'exit', count: 1 }], extraK: 0 },
      ],
    },
    band: { flowMin: 150, flowMax: 260 },
    search,
  };
}

/** A pond: a short suction line, 12 m of 3-inch to a tee, a falls 3 m up and a filter return 0.5 m up under pressure. */
function fallsAndFilter(): DesignDraft {
  return {
    unitSystem: 'si',
    system: {
      staticMode: 'levels',
      staticHead: 0,
      intakeLevel: 50,
      dischargeLevel: 53,
      outletPressureHead: 0,
      waterTemperatureC: 18,
      frictionMethod: 'hazen-williams',
      siteElevation: 300,
      pumpElevation: 0.6,
      segments: [
        { series: 'pvc-sch40', size: 'pvc-sch40-3', length: 2, fittings: [], extraK: 0, side: 'suction' },
        { series: 'pvc-sch40', size: 'pvc-sch40-3', length: 12, fittings: [{ kind: 'tee-run', count: 1 }], extraK: 0 },
      ],
      branches: [
        {
          name: 'Falls',
          staticMode: 'levels',
          staticHead: 0,
          outletLevel: 53,
          outletPressureHead: 0,
          segments: [
            { series: 'pvc-sch40', size: 'pvc-sch40-2', length: 15, fittings: [{ kind: 'exit', count: 1 }], extraK: 0 },
          ],
        },
        {
          name: 'Filter return',
          staticMode: 'levels',
          staticHead: 0,
          outletLevel: 50.5,
          outletPressureHead: 1.5,
          segments: [
            {
              series: 'pvc-sch40',
              size: 'pvc-sch40-1.5',
              length: 25,
              fittings: [{ kind: 'exit', count: 1 }],
              extraK: 0,
            },
          ],
        },
      ],
    },
    band: { flowMin: 150, flowMax: 260 },
    search,
  };
}

describe('projects with branches and a suction side', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let pumpId: number;

  before(async () => {
    scratch = await createScratchDatabase('branched-projects');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    const supplier = await Supplier.create({ code: 'HERON', name: 'Heron Test Pumps (invented)' });
    expect((await importText(scratch.sequelize, supplier, curveTable)).errors).to.deep.equal([]);
    pumpId = (await Pump.findOne({ where: { modelCode: 'H-30' } }))!.id;
  });

  after(async () => {
    await scratch?.drop();
  });

  const as = (token: string) => ({
    get: (path: string) => request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    post: (path: string, body?: object) =>
      request(app).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body),
    put: (path: string, body: object) =>
      request(app).put(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body),
  });

  it('opens a design saved without branches as it was and evaluates it as the single route it was', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    // the mapping of an old design is the route it always was
    expect(designPipeSystem(singleRoute().system)).to.deep.equal({
      staticHead: 4,
      outletPressureHead: 0,
      frictionMethod: 'hazen-williams',
      waterTemperatureC: 20,
      segments: [{ length: 30, pipe: 'pvc-sch40-2', fittings: [{ kind: 'exit', count: 1 }], minorLossK: 0 }],
    });
    const created = (await designer.post('/projects', { name: 'Old pond', design: singleRoute() }).expect(201))
      .body as Project;
    const opened = (await designer.get(`/projects/${created.id}`).expect(200)).body as Project;
    expect(opened.design).to.deep.equal(singleRoute());
    await designer.put(`/projects/${created.id}`, { name: 'Old pond', design: singleRoute() }).expect(200);
    const comparison = (await designer.get(`/projects/${created.id}/revision-comparison?from=1&to=2`).expect(200))
      .body as RevisionComparison;
    expect(comparison.changes).to.deep.equal([]);
    const curve = (
      await designer
        .post('/calculations/system-curve', {
          units,
          system: designPipeSystem(singleRoute().system),
          flows: [150, 205, 260],
        })
        .expect(200)
    ).body as SystemCurveResponse;
    comparison.after.systemHead.forEach((point, index) => {
      expect(point.head).to.be.closeTo(curve.points[index].head, 1e-9);
      expect(point.branches).to.equal(undefined);
    });
  });

  it('saves branches and a suction side, reopens them as entered, and evaluates each branch as the calculations do', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const created = (
      await designer
        .post('/projects', {
          name: 'Falls and filter',
          design: fallsAndFilter(),
          choice: { pumpId, arrangement: { installed: 1, running: 1 } },
        })
        .expect(201)
    ).body as Project;
    const opened = (await designer.get(`/projects/${created.id}`).expect(200)).body as Project;
    expect(opened.design).to.deep.equal(fallsAndFilter());

    const moved = fallsAndFilter();
    moved.system.branches![0].outletLevel = 53.4;
    await designer.put(`/projects/${created.id}`, { name: 'Falls and filter', design: moved }).expect(200);
    const comparison = (await designer.get(`/projects/${created.id}/revision-comparison?from=1&to=2`).expect(200))
      .body as RevisionComparison;
    expect(comparison.changes).to.deep.equal([{ pointer: '/system/branches/0/outletLevel', from: 53, to: 53.4 }]);

    const curve = (
      await designer
        .post('/calculations/system-curve', { units, system: designPipeSystem(moved.system), flows: [150, 205, 260] })
        .expect(200)
    ).body as SystemCurveResponse;
    expect(comparison.after.systemHead.map((point) => point.flow)).to.deep.equal([150, 205, 260]);
    comparison.after.systemHead.forEach((point, index) => {
      expect(point.head).to.be.closeTo(curve.points[index].head, 1e-9);
      expect(point.branches!.map((branch) => branch.name)).to.deep.equal(['Falls', 'Filter return']);
      point.branches!.forEach((branch, at) => {
        expect(branch.flow).to.be.closeTo(curve.points[index].branches![at].flow, 1e-9);
        expect(branch.velocity).to.be.closeTo(curve.points[index].branches![at].velocity, 1e-9);
      });
      // the split adds up to the total
      expect(point.branches!.reduce((sum, branch) => sum + branch.flow, 0)).to.be.closeTo(point.flow, 1e-6);
    });
    // the higher falls takes less after the move, at every flow
    comparison.after.systemHead.forEach((point, index) =>
      expect(point.branches![0].flow).to.be.lessThan(comparison.before.systemHead[index].branches![0].flow),
    );

    // the re-check puts the chosen pump on the same system: its operating point splits as the calculations say
    const recheck = (await designer.post(`/projects/${created.id}/recheck`).expect(200)).body as ProjectRecheck;
    const point = recheck.saved.operatingPoint!;
    const atPoint = (
      await designer
        .post('/calculations/system-curve', { units, system: designPipeSystem(moved.system), flows: [point.flow] })
        .expect(200)
    ).body as SystemCurveResponse;
    expect(point.head).to.be.closeTo(atPoint.points[0].head, 1e-6);
    expect(point.branches!.map((branch) => branch.name)).to.deep.equal(['Falls', 'Filter return']);
    point.branches!.forEach((branch, at) =>
      expect(branch.flow).to.be.closeTo(atPoint.points[0].branches![at].flow, 1e-6),
    );
  });

  it('refuses a repeated branch name, a branch pipe not in the catalogue and an empty single route by field, saving nothing', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const repeated = fallsAndFilter();
    repeated.system.branches![1].name = ' Falls ';
    const named = await designer.post('/projects', { name: 'Twice', design: repeated }).expect(422);
    expect(named.body.pointer).to.equal('/body/design/system/branches/1/name');
    const unknown = fallsAndFilter();
    unknown.system.branches![1].segments[0].size = 'pvc-sch40-99';
    const sized = await designer.post('/projects', { name: 'Unknown', design: unknown }).expect(422);
    expect(sized.body.pointer).to.equal('/body/design/system/branches/1/segments/0/size');
    const empty = singleRoute();
    empty.system.segments = [];
    const bare = await designer.post('/projects', { name: 'Bare', design: empty }).expect(400);
    expect(JSON.stringify(bare.body)).to.contain('/body/design/system/segments');
    const one = fallsAndFilter();
    one.system.branches = one.system.branches!.slice(0, 1);
    const single = await designer.post('/projects', { name: 'One', design: one }).expect(400);
    expect(JSON.stringify(single.body)).to.contain('/body/design/system/branches');
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });
});
