import { expect } from 'chai';
import request from 'supertest';
import type {
  DesignDraft,
  Project,
  ProjectRecheck,
  ProjectRevisionList,
  RevisionComparison,
  SelectionResponse,
} from '../../../shared/api/api-schemas';
import { createApp } from '../../../server/app';
import { Pump, Supplier } from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { designPipeSystem } from '../../../shared/api/design-system';
import { createUserWithSession, tableChecksums } from '../../support/accounts';
import { createScratchDatabase } from '../../support/test-database';
import { importText } from '../../data-import/catalog-fixtures';
import { snapshotClock, STAMP_REUSE_MS } from '../../../server/catalog/catalog-snapshot';

/** Two invented pumps; K-10 publishes its preferred range, 4 to 7 m3/h. */
const curveTable = [
  'riffle-curve-table,1',
  'flow-unit,m3/h',
  'head-unit,m',
  'efficiency-unit,%',
  'model_code,display_name,kind,preferred_flow_min,preferred_flow_max,flow,head,efficiency',
  'K-10,Kestrel test pump 10,submersible,4,7,0,8.0,0',
  'K-10,,,,,2,7.7,30',
  'K-10,,,,,4,7.0,48',
  'K-10,,,,,6,5.9,55',
  'K-10,,,,,8,4.4,50',
  'K-10,,,,,10,2.5,36',
  'K-20,Kestrel test pump 20,mixed-flow,,,0,5,',
  'K-20,,,,,50,4.2,',
  'K-20,,,,,100,2.6,',
].join('\n');

/** K-10 published again with some 2 m less head: the curve revision that re-check must notice. */
const weakerCurveTable = curveTable
  .replace('4,7,0,8.0,0', '4,7,0,5.0,0')
  .replace(',2,7.7,30', ',2,4.8,30')
  .replace(',4,7.0,48', ',4,4.4,48')
  .replace(',6,5.9,55', ',6,3.6,55')
  .replace(',8,4.4,50', ',8,2.4,50')
  .replace(',10,2.5,36', ',10,0.8,36');

/** A pond lifted 4 m through 30 m of 2-inch pipe, for 150 to 260 L/min. */
function firstVisit(): DesignDraft {
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
        {
          series: 'pvc-sch40',
          size: 'pvc-sch40-2',
          length: 30,
          fittings: [{ kind: 'elbow-90-standard', count: 2 }],
          extraK: 0,
        },
      ],
    },
    band: { flowMin: 150, flowMax: 260 },
    search: {
      arrangements: [2],
      requireOneFailed: true,
      standby: false,
      onlyPreferredRegion: false,
      maxInputPowerPerPump: null,
      hoursPerDay: 24,
      tariffPerKWh: null,
      limit: 20,
    },
  };
}

describe('projects: site visits, what they changed, and the re-check', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let supplier: Supplier;
  let pumpId: number;

  before(async () => {
    scratch = await createScratchDatabase('project-history');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    supplier = await Supplier.create({ code: 'KESTREL', name: 'Kestrel Test Pumps (invented)' });
    expect((await importText(scratch.sequelize, supplier, curveTable)).errors).to.deep.equal([]);
    pumpId = (await Pump.findOne({ where: { modelCode: 'K-10' } }))!.id;
  });

  after(async () => {
    await scratch?.drop();
  });

  const as = (token: string) => ({
    get: (path: string) => request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
    post: (path: string, body?: object) =>
      request(app).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body),
    put: (path: string, body: object, etag?: string) => {
      const pending = request(app).put(`/api/v1${path}`).set('Authorization', `Bearer ${token}`);
      return (etag === undefined ? pending : pending.set('If-Match', etag)).send(body);
    },
  });

  /** What the candidates page gets for the same system, band and arrangement. */
  async function searched(designer: ReturnType<typeof as>, design: DesignDraft) {
    const answer = (
      await designer
        .post('/selections', {
          units: { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' },
          system: designPipeSystem(design.system),
          duty: design.band,
          arrangements: [2],
          requireOneFailed: true,
          limit: 5,
        })
        .expect(200)
    ).body as SelectionResponse;
    return answer.candidates.find((candidate) => candidate.pumpId === pumpId)!;
  }

  it('keeps each save as a dated visit with author and notes, and compares two visits as the search would', async () => {
    const { user, token } = await createUserWithSession(scratch.sequelize, 'designer', { name: 'Dana Reed' });
    const designer = as(token);
    const created = await designer
      .post('/projects', {
        name: 'Kestrel pond',
        design: firstVisit(),
        choice: { pumpId, arrangement: { installed: 2, running: 2 } },
        visit: { visitedOn: '2026-11-20', notes: 'First survey.' },
      })
      .expect(201);
    const project = created.body as Project;
    expect(created.headers.etag).to.equal(`"p${project.id}r1"`);
    expect(project.choice).to.include({ pumpId, modelCode: 'K-10', curveRevisionNumber: 1, speedRpm: null });

    const second = firstVisit();
    second.system.staticHead = 4.6;
    second.system.segments[0].length = 42;
    second.system.segments[0].fittings = [
      { kind: 'elbow-90-standard', count: 4 },
      { kind: 'exit', count: 1 },
    ];
    const saved = await designer
      .put(
        `/projects/${project.id}`,
        { name: 'Kestrel pond', design: second, visit: { visitedOn: '2026-12-01', notes: 'Weir raised.' } },
        created.headers.etag,
      )
      .expect(200);
    expect(saved.headers.etag).to.equal(`"p${project.id}r2"`);
    // the choice was left out: the one chosen before is kept
    expect((saved.body as Project).choice?.pumpId).to.equal(pumpId);

    const history = (await designer.get(`/projects/${project.id}/revisions`).expect(200)).body as ProjectRevisionList;
    expect(
      history.revisions.map(({ number, visitedOn, notes, author }) => ({ number, visitedOn, notes, author })),
    ).to.deep.equal([
      { number: 1, visitedOn: '2026-11-20', notes: 'First survey.', author: { id: user.id, name: 'Dana Reed' } },
      { number: 2, visitedOn: '2026-12-01', notes: 'Weir raised.', author: { id: user.id, name: 'Dana Reed' } },
    ]);
    expect(history.revisions[0].design).to.deep.equal(firstVisit());

    const comparison = (await designer.get(`/projects/${project.id}/revision-comparison?from=1&to=2`).expect(200))
      .body as RevisionComparison;
    expect(comparison.changes).to.deep.equal([
      { pointer: '/system/staticHead', from: 4, to: 4.6 },
      { pointer: '/system/segments/0/length', from: 30, to: 42 },
      { pointer: '/system/segments/0/fittings/elbow-90-standard', from: 2, to: 4 },
      { pointer: '/system/segments/0/fittings/exit', from: null, to: 1 },
    ]);
    // more lift and more pipe: more head at every flow of the band, and the pumps settle lower
    comparison.after.systemHead.forEach((point, index) => {
      expect(point.flow).to.equal(comparison.before.systemHead[index].flow);
      expect(point.head).to.be.greaterThan(comparison.before.systemHead[index].head + 0.6);
    });
    const before = comparison.before.choice!;
    const after = comparison.after.choice!;
    expect(after.operatingPoint!.flow).to.be.lessThan(before.operatingPoint!.flow);
    for (const [outcome, design] of [
      [before, firstVisit()],
      [after, second],
    ] as const) {
      const candidate = await searched(designer, design);
      expect(outcome.operatingPoint!.flow).to.be.closeTo(candidate.operatingPoint.flow, 1e-6);
      expect(outcome.operatingPoint!.head).to.be.closeTo(candidate.operatingPoint.head, 1e-6);
      expect(outcome.inBand).to.equal(candidate.inBand);
      expect(outcome.region).to.equal(candidate.region);
      expect(outcome.redundant).to.equal(candidate.oneFailedMeetsMinimum === true);
      expect(outcome.reasons).to.deep.equal(candidate.reasons);
    }
    // the system head at the band's ends is the calculations' own system curve
    const curve = (
      await designer
        .post('/calculations/system-curve', {
          units: { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm' },
          system: designPipeSystem(second.system),
          flows: [150, 205, 260],
        })
        .expect(200)
    ).body as { points: Array<{ flow: number; head: number }> };
    expect(comparison.after.systemHead.map((point) => point.flow)).to.deep.equal([150, 205, 260]);
    comparison.after.systemHead.forEach((point, index) =>
      expect(point.head).to.be.closeTo(curve.points[index].head, 1e-9),
    );
    await designer.get(`/projects/${project.id}/revision-comparison?from=1&to=9`).expect(404);
  });

  it('says so in words when the chosen pumps cannot lift the water of a later visit', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const created = await designer
      .post('/projects', {
        name: 'Hilltop',
        design: firstVisit(),
        choice: { pumpId, arrangement: { installed: 2, running: 2 } },
      })
      .expect(201);
    const higher = firstVisit();
    higher.system.staticHead = 12;
    const id = (created.body as Project).id;
    await designer
      .put(`/projects/${id}`, { name: 'Hilltop', design: higher }, created.headers.etag as string)
      .expect(200);
    const comparison = (await designer.get(`/projects/${id}/revision-comparison?from=1&to=2`).expect(200))
      .body as RevisionComparison;
    expect(comparison.before.choice!.operatingPoint).to.not.equal(null);
    // K-10 shuts off at 8 m, below the 12 m lift
    expect(comparison.after.choice).to.deep.include({
      operatingPoint: null,
      inBand: false,
      region: null,
      redundant: false,
    });
    expect(comparison.after.choice!.reasons).to.deep.equal([
      "shut-off head 8 m is below the system's static head 12 m",
    ]);
  });

  it('refuses a save on a stale ETag with 412 and writes nothing; a save without If-Match is taken', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const created = await designer.post('/projects', { name: 'Two tabs', design: firstVisit() }).expect(201);
    const id = (created.body as Project).id;
    const first = created.headers.etag as string;
    const changed = firstVisit();
    changed.system.staticHead = 5;
    const won = await designer.put(`/projects/${id}`, { name: 'Two tabs', design: changed }, first).expect(200);
    const beforeStale = await tableChecksums(scratch.sequelize, ['sessions']);
    const stale = await designer.put(`/projects/${id}`, { name: 'Two tabs', design: firstVisit() }, first).expect(412);
    expect(stale.headers['content-type']).to.match(/application\/problem\+json/);
    expect(stale.body).to.include({ status: 412, pointer: '/headers/if-match', currentRevision: 2 });
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(beforeStale);
    expect((await designer.get(`/projects/${id}`).expect(200)).body.design.system.staticHead).to.equal(5);

    await designer.put(`/projects/${id}`, { name: 'Two tabs', design: firstVisit() }, won.headers.etag).expect(200);
    const blind = await designer.put(`/projects/${id}`, { name: 'Two tabs', design: changed }).expect(200);
    expect((blind.body as Project).revision).to.equal(4);
    await designer.put(`/projects/${id}`, { name: 'Two tabs', design: changed }, '*').expect(200);
  });

  it('refuses a choice of a pump or curve revision that is not in the catalog, naming the field', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const unknown = await designer
      .post('/projects', {
        name: 'Nope',
        design: firstVisit(),
        choice: { pumpId: 999_999, arrangement: { installed: 2, running: 2 } },
      })
      .expect(422);
    expect(unknown.body.errors[0].pointer).to.equal('/body/choice/pumpId');
    const other = (await Pump.findOne({ where: { modelCode: 'K-20' } }))!;
    const foreign = await designer
      .post('/projects', {
        name: 'Nope',
        design: firstVisit(),
        choice: { pumpId, arrangement: { installed: 2, running: 2 }, curveRevisionId: other.currentRevisionId },
      })
      .expect(422);
    expect(foreign.body.errors[0].pointer).to.equal('/body/choice/curveRevisionId');
    const arrangement = await designer
      .post('/projects', {
        name: 'Nope',
        design: firstVisit(),
        choice: { pumpId, arrangement: { installed: 1, running: 2 } },
      })
      .expect(422);
    expect(arrangement.body.errors[0].pointer).to.equal('/body/choice/arrangement/installed');
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it('re-checks the saved choice: no newer curve leaves it, a newer weaker curve changes the answer', async () => {
    const designer = as((await createUserWithSession(scratch.sequelize, 'designer')).token);
    const plain = (await designer.post('/projects', { name: 'No pump yet', design: firstVisit() }).expect(201))
      .body as Project;
    expect((await designer.post(`/projects/${plain.id}/recheck`).expect(422)).body.errors[0].pointer).to.equal(
      '/path/projectId',
    );
    const project = (
      await designer
        .post('/projects', {
          name: 'Recheck pond',
          design: firstVisit(),
          choice: { pumpId, arrangement: { installed: 2, running: 2 } },
        })
        .expect(201)
    ).body as Project;
    const unchanged = (await designer.post(`/projects/${project.id}/recheck`).expect(200)).body as ProjectRecheck;
    expect(unchanged).to.include({ newerCurve: false, changesAnswer: false });
    expect(unchanged.current).to.deep.equal(unchanged.saved);
    expect(unchanged.saved.inBand).to.equal(true);

    const report = await importText(scratch.sequelize, supplier, weakerCurveTable, { fileName: 'kestrel-2.csv' });
    expect(report.pumps.find((pump) => pump.modelCode === 'K-10')).to.include({
      outcome: 'changed',
      revisionNumber: 2,
    });
    const rechecked = (await designer.post(`/projects/${project.id}/recheck`).expect(200)).body as ProjectRecheck;
    expect(rechecked.newerCurve).to.equal(true);
    expect(rechecked.saved).to.deep.equal(unchanged.saved);
    expect(rechecked.current!.curveRevisionNumber).to.equal(2);
    expect(rechecked.current!.inBand).to.equal(false);
    expect(rechecked.changesAnswer).to.equal(true);
    expect(rechecked.summary).to.equal(
      'curve revision 2 of K-10 changes the answer: out of the duty band; region preferred becomes outside',
    );
    // the current curve's outcome is the search's own on today's catalog; move the snapshot's clock
    // past its stamp reuse so the search sees the import made straight into the database
    const realClock = snapshotClock.now;
    snapshotClock.now = () => realClock() + STAMP_REUSE_MS + 50;
    const candidate = await searched(designer, firstVisit()).finally(() => (snapshotClock.now = realClock));
    expect(rechecked.current!.operatingPoint!.flow).to.be.closeTo(candidate.operatingPoint.flow, 1e-6);
    expect(rechecked.current!.inBand).to.equal(candidate.inBand);
    // the project itself still records the curve revision it was chosen on
    expect(
      ((await designer.get(`/projects/${project.id}`).expect(200)).body as Project).choice?.curveRevisionNumber,
    ).to.equal(1);
  });
});
