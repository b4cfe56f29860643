import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import type { OpenAPIV3_1 } from 'openapi-types';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { snapshotClock, STAMP_REUSE_MS } from '../../../server/catalog/catalog-snapshot';
import {
  classifyOperatingRegion,
  compileSystemCurve,
  DEFAULT_MOTOR_EFFICIENCY_BY_KIND,
  DEFAULT_PREFERRED_BAND,
  flowToSI,
  headToSI,
  lengthToSI,
  powerAtOperatingPoint,
  solveParallelIdentical,
  VELOCITY_WARNING_LIMIT,
  waterDensity,
  type PumpCurveFit,
} from '../../../shared/hydraulics';
import type { SelectionCandidate, SelectionResponse } from '../../../shared/api/api-schemas';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from './synthetic-catalog';

/*
 * The search over a catalog of 400 invented pumps, checked against a brute-force pass that puts
 * every pump on the system with the engine's own solver (no shortcut), and against the ranking
 * rule: in band and missing fewest requirements (preferred region, redundancy when asked, pipe
 * velocity) first, then by wire-to-water energy.
 */

const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
const system = {
  staticHead: 14.5,
  frictionMethod: 'hazen-williams',
  segments: [
    {
      length: 240,
      pipe: 'pvc-sch40-3',
      fittings: [
        { kind: 'elbow-90-standard', count: 4 },
        { kind: 'exit', count: 1 },
      ],
    },
  ],
};
const duty = { flowMin: 90, flowMax: 130 };
const search = {
  units,
  system,
  duty,
  arrangements: [1, 2, 3],
  requireOneFailed: true,
  energy: { hoursPerDay: 24, tariffPerKWh: 0.2 },
  limit: 50,
};

/** In band: how many of the requirements asked it misses (region, one failed, velocity); outside: last. */
function tierOf(candidate: SelectionCandidate): number {
  if (!candidate.inBand) return 9;
  return [
    candidate.region !== 'preferred',
    candidate.oneFailedMeetsMinimum !== true,
    candidate.warnings.includes('velocity'),
  ].filter(Boolean).length;
}

describe('POST /api/v1/selections', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;

  const post = (path: string, body: unknown, bearer: string | null = token) => {
    const call = request(app).post(`/api/v1${path}`);
    return (bearer ? call.set('Authorization', `Bearer ${bearer}`) : call).send(body as object);
  };

  /**
   * Every pump of the catalog on the system with the engine's own solver (no shortcut): the pairs
   * tried, those in band, and the least-energy pair in band of those missing fewest requirements
   * (preferred region; redundancy: the rest reaching the band's minimum with one off, or a standby
   * taking over; pipe velocity).
   */
  async function bruteForce(frictionMethod: 'hazen-williams' | 'darcy-weisbach', redundancy: 'one failed' | 'standby') {
    const rows = await scratch.sequelize.query<{ pump_id: number; fit: string | PumpCurveFit }>(
      'SELECT p.id AS pump_id, r.fit FROM pumps p JOIN curve_revisions r ON r.id = p.current_revision_id',
      { type: QueryTypes.SELECT },
    );
    const compiled = compileSystemCurve({
      staticHead: headToSI(14.5, 'ft'),
      frictionMethod,
      segments: [{ length: lengthToSI(240, 'ft'), pipeSizeId: 'pvc-sch40-3', fittings: system.segments[0].fittings }],
    });
    const [low, high] = [flowToSI(duty.flowMin, 'gpm'), flowToSI(duty.flowMax, 'gpm')];
    const density = waterDensity(20);
    let inBand = 0;
    let best: { pumpId: number; running: number; misses: number; energy: number } | null = null;
    for (const row of rows) {
      const fit = (typeof row.fit === 'string' ? JSON.parse(row.fit) : row.fit) as PumpCurveFit;
      for (const running of [1, 2, 3]) {
        const point = solveParallelIdentical(fit, compiled, running, running);
        if (!point.ok || point.totalFlow < low || point.totalFlow > high) continue;
        inBand += 1;
        const perPump = point.totalFlow / running;
        const failed = running > 1 ? solveParallelIdentical(fit, compiled, running - 1, running - 1) : null;
        const redundant = redundancy === 'standby' || (failed !== null && failed.ok && failed.totalFlow >= low);
        const velocityOk = compiled.segments.every(
          (segment) => point.totalFlow / segment.area <= VELOCITY_WARNING_LIMIT,
        );
        const preferred = classifyOperatingRegion(fit, perPump, DEFAULT_PREFERRED_BAND).region === 'preferred';
        const misses = [!preferred, !redundant, !velocityOk].filter(Boolean).length;
        // the synthetic pumps are submersibles whose curves give pump efficiency: wire-to-water with the kind's motor
        const motor = DEFAULT_MOTOR_EFFICIENCY_BY_KIND.submersible;
        const energy = powerAtOperatingPoint(fit, perPump, point.head, density, { motor }).electrical! * running;
        if (!best || misses < best.misses || (misses === best.misses && energy < best.energy))
          best = { pumpId: row.pump_id, running, misses, energy };
      }
    }
    return { pairs: rows.length * 3, inBand, best };
  }

  before(async () => {
    scratch = await createScratchDatabase('selection');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(400, 11));
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  const realClock = snapshotClock.now;
  after(async () => {
    snapshotClock.now = realClock;
    await scratch?.drop();
  });

  it('answers the contract example with a body its schema accepts', async () => {
    const operation = (openApiDocument.paths?.['/selections'] as OpenAPIV3_1.PathItemObject)
      .post as OpenAPIV3_1.OperationObject;
    const media = (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'];
    const example = (media.examples?.['single-route'] as OpenAPIV3_1.ExampleObject).value as object;
    const response = await post('/selections', example).expect(200);
    const validate = contractSchemaValidator('SelectionResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    expect(response.body.candidates.length).to.be.within(1, 10);
    for (const candidate of response.body.candidates as SelectionCandidate[]) {
      expect(candidate.operatingPoint.inputPower! / candidate.arrangement.running).to.be.at.most(1.5 + 1e-9);
    }
  });

  for (const frictionMethod of ['hazen-williams', 'darcy-weisbach'] as const) {
    it(`finds the same pairs in band as putting every pump on the system with the engine (${frictionMethod})`, async () => {
      const response = await post('/selections', { ...search, system: { ...system, frictionMethod } }).expect(200);
      const body = response.body as SelectionResponse;
      const { pairs, inBand, best } = await bruteForce(frictionMethod, 'one failed');
      expect(body.considered).to.equal(pairs);
      expect(body.inBand).to.equal(inBand);
      expect(inBand, 'the synthetic catalog should put some pumps in this band').to.be.greaterThan(5);
      expect(best, 'some pair should be in band').to.not.equal(null);
      expect(body.candidates[0].misses.length).to.equal(best!.misses);
      expect(body.candidates[0]).to.include({ pumpId: best!.pumpId });
      expect(body.candidates[0].arrangement.running).to.equal(best!.running);
      // annual energy: input power x 24 h x 365 d
      expect(body.candidates[0].annualKWh).to.be.closeTo((best!.energy * 24 * 365) / 1000, 1e-3);
      expect(body.candidates[0].annualCost).to.be.closeTo(body.candidates[0].annualKWh! * 0.2, 1e-6);
    });
  }

  it('with a standby pump: one more installed, the same point when one fails, and the least-energy pair in band and preferred leads', async () => {
    const body = (await post('/selections', { ...search, standby: true }).expect(200)).body as SelectionResponse;
    const { best } = await bruteForce('hazen-williams', 'standby');
    expect(best).to.not.equal(null);
    expect(body.candidates[0]).to.include({ pumpId: best!.pumpId });
    expect(body.candidates[0].arrangement).to.deep.equal({ installed: best!.running + 1, running: best!.running });
    for (const candidate of body.candidates) {
      expect(candidate.arrangement.installed).to.equal(candidate.arrangement.running + 1);
      expect(candidate.oneFailed).to.deep.equal(candidate.operatingPoint);
      expect(candidate.oneFailedMeetsMinimum).to.equal(candidate.operatingPoint.flow >= duty.flowMin * (1 - 1e-9));
      if (candidate.inBand)
        expect(candidate.reasons).to.include('one failed: the standby takes over at the same point');
    }
  });

  it('ranks in band and missing fewest requirements first, then by annual energy, and says why', async () => {
    const body = (await post('/selections', search).expect(200)).body as SelectionResponse;
    const candidates = body.candidates;
    expect(candidates.map((candidate) => candidate.rank)).to.deep.equal(candidates.map((_, index) => index + 1));
    for (let index = 1; index < candidates.length; index += 1) {
      const [before, after] = [candidates[index - 1], candidates[index]];
      expect(tierOf(before)).to.be.at.most(tierOf(after));
      if (tierOf(before) === tierOf(after)) expect(before.annualKWh!).to.be.at.most(after.annualKWh!);
    }
    for (const candidate of candidates) {
      expect(candidate.reasons[0]).to.equal(
        candidate.inBand
          ? 'in the duty band'
          : candidate.operatingPoint.flow < duty.flowMin
            ? 'below the duty band'
            : 'above the duty band',
      );
      if (candidate.region === 'outside') {
        const percent = candidate.operatingPoint.percentOfBep;
        expect(candidate.reasons).to.include(
          `outside POR${percent === null ? '' : ` (${Math.round(percent)} % of BEP)`}`,
        );
      }
      if (candidate.arrangement.running === 1)
        expect(candidate.reasons).to.include('a single pump: no flow at all when it fails');
      if (candidate.oneFailedMeetsMinimum === false)
        expect(candidate.reasons.some((reason) => reason.includes('with one failed'))).to.equal(true);
      if (candidate.warnings.includes('run-out')) expect(candidate.reasons).to.include('run-out');
      expect(candidate.operatingPoint.flowPerPump).to.be.closeTo(
        candidate.operatingPoint.flow / candidate.arrangement.running,
        1e-9,
      );
      expect(candidate.curve.length).to.be.greaterThan(2);
    }
    const tiers = new Set(candidates.map(tierOf));
    expect(tiers.size, 'a 50-long answer over this catalog spans more than one group').to.be.greaterThan(1);
  });

  it('gives each candidate the operating point the single-pump calculation gives for that pump', async () => {
    const body = (await post('/selections', search).expect(200)).body as SelectionResponse;
    const candidate = body.candidates[0];
    const single = await post('/calculations/operating-point', {
      units,
      system,
      pump: { pumpId: candidate.pumpId },
      arrangement: candidate.arrangement,
    }).expect(200);
    expect(single.body.operatingPoint.flow).to.be.closeTo(candidate.operatingPoint.flow, 1e-6);
    expect(single.body.operatingPoint.head).to.be.closeTo(candidate.operatingPoint.head, 1e-6);
    expect(single.body.oneFailed.flow).to.be.closeTo(candidate.oneFailed!.flow, 1e-6);
    const curve = await post('/calculations/system-curve', {
      units,
      system,
      flows: [candidate.operatingPoint.flow],
    }).expect(200);
    expect(curve.body.points[0].head).to.be.closeTo(candidate.operatingPoint.head, 1e-6);
  });

  it('answers 404 naming the field for a pump id that is not in the catalog', async () => {
    const response = await post('/calculations/operating-point', { units, system, pump: { pumpId: 999_999 } }).expect(
      404,
    );
    expect(response.body.pointer).to.equal('/body/pump/pumpId');
  });

  it('keeps only what the filters allow', async () => {
    const onlyPreferred = (
      await post('/selections', {
        ...search,
        filters: { onlyPreferredRegion: true, maxInputPowerPerPump: 0.8 },
      }).expect(200)
    ).body as SelectionResponse;
    expect(onlyPreferred.candidates.length).to.be.greaterThan(0);
    for (const candidate of onlyPreferred.candidates) {
      expect(candidate.region).to.equal('preferred');
      expect(candidate.operatingPoint.inputPower! / candidate.arrangement.running).to.be.at.most(0.8 + 1e-9);
    }
    const none = (await post('/selections', { ...search, filters: { supplierIds: [987_654] } }).expect(200))
      .body as SelectionResponse;
    expect(none.candidates).to.deep.equal([]);
    expect(none.warnings.join(' ')).to.contain('no catalog pump');
  });

  it('sees a new curve revision without a restart', async () => {
    const before = (await post('/selections', search).expect(200)).body as SelectionResponse;
    // One invented pump whose BEP (60 % of its last flow, 110 gpm) sits on this system at about 6.6 m.
    const [pumpId] = await seedSyntheticCatalog(
      scratch.sequelize,
      [{ shutOffHead: 10, lastFlow: 0.0116, peakEfficiency: 0.8 }],
      'Late Test Pumps',
    );
    const [{ supplierId }] = await scratch.sequelize.query<{ supplierId: number }>(
      'SELECT supplier_id AS supplierId FROM pumps WHERE id = ?',
      {
        replacements: [pumpId],
        type: QueryTypes.SELECT,
      },
    );
    // time moves on past the stamp's reuse, without waiting for it; monotonic for the rest of the suite
    snapshotClock.now = () => realClock() + STAMP_REUSE_MS + 50;
    const after = (await post('/selections', search).expect(200)).body as SelectionResponse;
    expect(after.considered).to.equal(before.considered + 3);
    const onlyNew = (await post('/selections', { ...search, filters: { supplierIds: [supplierId] } }).expect(200))
      .body as SelectionResponse;
    expect(onlyNew.candidates.map((candidate) => candidate.pumpId)).to.include(pumpId);
    const single = onlyNew.candidates.find((candidate) => candidate.arrangement.running === 1)!;
    expect(single.inBand).to.equal(true);
    expect(single.region).to.equal('preferred');
    expect(before.candidates.some((candidate) => candidate.pumpId === pumpId)).to.equal(false);
  });

  it('asks for a signed-in designer, integrator or admin', async () => {
    await post('/selections', search, null).expect(401);
    const supplierAdmin = await createUserWithSession(scratch.sequelize, 'supplier-admin', { supplierId: 1 });
    await post('/selections', search, supplierAdmin.token).expect(403);
  });

  const badInputs: Array<{ name: string; body: unknown; status: number; pointer: string }> = [
    {
      name: 'a band with min above max',
      body: { ...search, duty: { flowMin: 130, flowMax: 90 } },
      status: 422,
      pointer: '/body/duty/flowMax',
    },
    {
      name: 'a zero band minimum',
      body: { ...search, duty: { flowMin: 0, flowMax: 90 } },
      status: 400,
      pointer: '/body/duty/flowMin',
    },
    {
      name: 'four pumps in parallel',
      body: { ...search, arrangements: [4] },
      status: 400,
      pointer: '/body/arrangements/0',
    },
    {
      name: 'thirty hours a day',
      body: { ...search, energy: { hoursPerDay: 30 } },
      status: 400,
      pointer: '/body/energy/hoursPerDay',
    },
    {
      name: 'an unknown head unit',
      body: { ...search, units: { ...units, head: 'cubit' } },
      status: 400,
      pointer: '/body/units/head',
    },
    {
      name: 'no segments',
      body: { ...search, system: { ...system, segments: [] } },
      status: 400,
      pointer: '/body/system/segments',
    },
    {
      name: 'an absurd band',
      body: { ...search, duty: { flowMin: 90, flowMax: 9e9 } },
      status: 422,
      pointer: '/body/duty/flowMax',
    },
    { name: 'a limit of zero', body: { ...search, limit: 0 }, status: 400, pointer: '/body/limit' },
  ];
  it("states the band's plausible limit in the request's units", async () => {
    const response = await post('/selections', { ...search, duty: { flowMin: 90, flowMax: 9e9 } }).expect(422);
    // 10 m3/s is 158503 gpm; the message rounds inward to four figures, so the figure stated is accepted
    expect(response.body.errors[0].detail).to.equal('flow must be at most 158500 gpm');
    const metric = { ...search, units: { ...units, flow: 'L/min' }, duty: { flowMin: 400, flowMax: 9e9 } };
    // 10 m3/s is 600 000 L/min
    expect((await post('/selections', metric).expect(422)).body.errors[0].detail).to.equal(
      'flow must be at most 600000 L/min',
    );
  });

  for (const { name, body, status, pointer } of badInputs) {
    it(`answers ${status} naming ${pointer} for ${name}`, async () => {
      const response = await post('/selections', body);
      expect(response.status, JSON.stringify(response.body)).to.equal(status);
      expect(response.type).to.equal('application/problem+json');
      expect(response.body.pointer).to.equal(pointer);
    });
  }
});
