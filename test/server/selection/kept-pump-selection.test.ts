import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import type { OpenAPIV3_1 } from 'openapi-types';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { snapshotClock } from '../../../server/catalog/catalog-snapshot';
import {
  compileSystemCurve,
  flowFromSI,
  flowToSI,
  headFromSI,
  headToSI,
  lengthToSI,
  solveParallelUnequal,
  type PumpCurveFit,
} from '../../../shared/hydraulics';
import type { SelectionCandidate, SelectionResponse } from '../../../shared/api/api-schemas';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticCurve, syntheticShapes } from './synthetic-catalog';

/*
 * The search beside a kept pump over 400 invented pumps: each candidate's set checked against
 * POST /calculations/operating-point for the same two pumps, against a brute-force bisection of
 * its own, and the screened count against the engine's mixed-set solve of every pump.
 */

const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in', power: 'kW' } as const;
const fittings = [
  { kind: 'elbow-90-standard', count: 4 },
  { kind: 'exit', count: 1 },
];
const system = {
  staticHead: 14.5,
  frictionMethod: 'hazen-williams',
  segments: [{ length: 240, pipe: 'pvc-sch40-3', fittings }],
};
const duty = { flowMin: 90, flowMax: 130 };
/** The pump kept: 12 m shut-off, 5 L/s at its last point; alone on this system some 65 gpm, below the band. */
const keptShape = { shutOffHead: 12, lastFlow: 0.005, peakEfficiency: 0.6 };

/** Head of a stored fit at a flow, by Horner on its coefficients (m, m3/s). */
function headOf(fit: PumpCurveFit, flow: number): number {
  return fit.headCoefficients.reduceRight((sum, coefficient) => sum * flow + coefficient, 0);
}

/** Plain bisection for the root of a falling function on [low, high]. */
function bisect(falling: (x: number) => number, low: number, high: number): number {
  for (let step = 0; step < 200; step += 1) {
    const middle = (low + high) / 2;
    if (falling(middle) > 0) low = middle;
    else high = middle;
  }
  return (low + high) / 2;
}

describe('POST /api/v1/selections with keep', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;
  let keptId: number;
  const fits = new Map<number, PumpCurveFit>();
  const compiled = compileSystemCurve({
    staticHead: headToSI(14.5, 'ft'),
    frictionMethod: 'hazen-williams',
    segments: [{ length: lengthToSI(240, 'ft'), pipeSizeId: 'pvc-sch40-3', fittings }],
  });

  const post = (path: string, body: unknown) =>
    request(app)
      .post(`/api/v1${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);
  const search = (extra: object = {}) => ({
    units,
    system,
    duty,
    keep: { pump: { pumpId: keptId } },
    energy: { hoursPerDay: 24, tariffPerKWh: 0.2 },
    limit: 30,
    ...extra,
  });

  before(async () => {
    scratch = await createScratchDatabase('kept-pump');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(400, 11));
    [keptId] = await seedSyntheticCatalog(scratch.sequelize, [keptShape], 'Installed Test Pumps');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    const rows = await scratch.sequelize.query<{ pump_id: number; fit: string | PumpCurveFit }>(
      'SELECT p.id AS pump_id, r.fit FROM pumps p JOIN curve_revisions r ON r.id = p.current_revision_id',
      { type: QueryTypes.SELECT },
    );
    for (const row of rows)
      fits.set(row.pump_id, (typeof row.fit === 'string' ? JSON.parse(row.fit) : row.fit) as PumpCurveFit);
  });
  const realClock = snapshotClock.now;
  after(async () => {
    snapshotClock.now = realClock;
    await scratch?.drop();
  });

  it('gives each candidate the set the operating point gives for the same two pumps', async () => {
    const answer = (await post('/selections', search()).expect(200)).body as SelectionResponse;
    const validate = contractSchemaValidator('SelectionResponse');
    expect(validate(answer), JSON.stringify(validate.errors)).to.equal(true);
    expect(answer.candidates.length).to.be.at.least(3);
    for (const candidate of answer.candidates.slice(0, 3)) {
      const point = (
        await post('/calculations/operating-point', {
          units,
          system,
          pumps: [
            { pump: { pumpId: keptId }, running: 1 },
            { pump: { pumpId: candidate.pumpId }, running: 1 },
          ],
        }).expect(200)
      ).body;
      const set = candidate.set!;
      expect(set.flow).to.be.closeTo(point.operatingPoint.flow, 1e-9);
      expect(set.head).to.be.closeTo(point.operatingPoint.head, 1e-9);
      expect(candidate.operatingPoint.flow).to.be.closeTo(point.operatingPoint.flow, 1e-9);
      expect(set.pumps.map((pump) => pump.role)).to.deep.equal(['kept', 'added']);
      expect(set.pumps.map((pump) => pump.pumpId)).to.deep.equal([keptId, candidate.pumpId]);
      for (const [index, pump] of set.pumps.entries()) {
        expect(pump.flow).to.be.closeTo(point.operatingPoint.pumps[index].flow, 1e-9);
        expect(pump.head).to.be.closeTo(point.operatingPoint.pumps[index].head, 1e-9);
        expect(pump.inputPower).to.be.closeTo(point.operatingPoint.pumps[index].inputPower, 1e-9);
      }
      expect(set.inputPower).to.be.closeTo(point.operatingPoint.inputPower, 1e-9);
      // the added pump's own figures, the set's energy
      expect(candidate.operatingPoint.flowPerPump).to.be.closeTo(set.pumps[1].flow, 1e-9);
      expect(candidate.region).to.equal(set.pumps[1].region);
      expect(candidate.annualKWh).to.be.closeTo(set.inputPower! * 24 * 365, 1e-6 * candidate.annualKWh!);
      expect(candidate.arrangement).to.deep.equal({ installed: 1, running: 1 });
    }
  });

  it('meets a brute-force bisection on the summed flows at a head', async () => {
    const answer = (await post('/selections', search({ limit: 1 })).expect(200)).body as SelectionResponse;
    const [candidate] = answer.candidates;
    const kept = fits.get(keptId)!;
    const added = fits.get(candidate.pumpId)!;
    const flowAt = (fit: PumpCurveFit, head: number) =>
      head >= headOf(fit, 0) ? 0 : bisect((flow) => headOf(fit, flow) - head, 0, fit.flowMax);
    const systemFlowAt = (head: number) => bisect((flow) => head - compiled.evaluate(flow), 0, 1);
    const head = bisect(
      (at) => flowAt(kept, at) + flowAt(added, at) - systemFlowAt(at),
      compiled.staticHead,
      Math.max(headOf(kept, 0), headOf(added, 0)),
    );
    const flow = flowAt(kept, head) + flowAt(added, head);
    expect(candidate.set!.flow).to.be.closeTo(flowFromSI(flow, 'gpm'), 1e-6 * candidate.set!.flow);
    expect(candidate.set!.head).to.be.closeTo(headFromSI(head, 'ft'), 1e-6 * candidate.set!.head);
    expect(candidate.set!.pumps[0].flow).to.be.closeTo(flowFromSI(flowAt(kept, head), 'gpm'), 1e-5);
    expect(candidate.set!.pumps[1].flow).to.be.closeTo(flowFromSI(flowAt(added, head), 'gpm'), 1e-5);
  });

  it('counts in band exactly the pumps the mixed-set solve puts there, and ranks them by misses then energy', async () => {
    const answer = (await post('/selections', search({ limit: 200 })).expect(200)).body as SelectionResponse;
    const [low, high] = [flowToSI(duty.flowMin, 'gpm'), flowToSI(duty.flowMax, 'gpm')];
    const kept = fits.get(keptId)!;
    let inBand = 0;
    for (const fit of fits.values()) {
      const solved = solveParallelUnequal([kept, fit], compiled);
      if (solved.ok && solved.totalFlow >= low && solved.totalFlow <= high) inBand += 1;
    }
    expect(inBand).to.be.greaterThan(10);
    expect(answer.inBand).to.equal(inBand);
    const ranked = answer.candidates.filter((candidate) => candidate.inBand);
    expect(ranked.length).to.equal(Math.min(inBand, 200));
    for (let at = 1; at < ranked.length; at += 1) {
      const [before, after] = [ranked[at - 1], ranked[at]];
      expect(before.misses.length).to.be.at.most(after.misses.length);
      if (before.misses.length === after.misses.length && before.annualKWh !== null && after.annualKWh !== null)
        expect(before.annualKWh).to.be.at.most(after.annualKWh);
    }
    expect(answer.considered).to.equal(fits.size);
  });

  it('checks both single failures with requireOneFailed and says which fails', async () => {
    const answer = (await post('/selections', search({ requireOneFailed: true, limit: 50 })).expect(200))
      .body as SelectionResponse;
    const keptAlone = (
      await post('/calculations/operating-point', { units, system, pump: { pumpId: keptId } }).expect(200)
    ).body.operatingPoint;
    // the kept pump alone stays below the band: no candidate is redundant
    expect(keptAlone.flow).to.be.below(duty.flowMin);
    for (const candidate of answer.candidates.slice(0, 5)) {
      const [keptStopped, addedStopped] = candidate.set!.stopped;
      expect(keptStopped.stopped).to.equal('kept');
      expect(addedStopped).to.deep.include({ stopped: 'added', meetsMinimum: false });
      expect(addedStopped.flow).to.be.closeTo(keptAlone.flow, 1e-6 * keptAlone.flow);
      const addedAlone = (
        await post('/calculations/operating-point', { units, system, pump: { pumpId: candidate.pumpId } }).expect(200)
      ).body.operatingPoint;
      expect(keptStopped.flow).to.be.closeTo(addedAlone.flow, 1e-6 * addedAlone.flow);
      expect(keptStopped.meetsMinimum).to.equal(addedAlone.flow >= duty.flowMin);
      expect(candidate.misses).to.include('redundancy');
      expect(candidate.oneFailedMeetsMinimum).to.equal(false);
      expect(candidate.reasons).to.include(
        'with the added pump stopped: the kept pump alone falls below the band minimum',
      );
    }
  });

  it('ranks redundant sets first when the kept pump alone reaches a lower band minimum', async () => {
    const lowBand = { flowMin: 60, flowMax: 130 };
    const answer = (await post('/selections', search({ duty: lowBand, requireOneFailed: true, limit: 60 })).expect(200))
      .body as SelectionResponse;
    const [redundant, notRedundant] = [
      answer.candidates.filter((candidate) => candidate.inBand && !candidate.misses.includes('redundancy')),
      answer.candidates.filter((candidate) => candidate.inBand && candidate.misses.includes('redundancy')),
    ];
    expect(redundant.length).to.be.greaterThan(0);
    expect(notRedundant.length).to.be.greaterThan(0);
    for (const candidate of [...redundant.slice(0, 3), ...notRedundant.slice(0, 3)]) {
      const addedAlone = (
        await post('/calculations/operating-point', { units, system, pump: { pumpId: candidate.pumpId } })
      ).body.operatingPoint;
      const reaches = addedAlone !== undefined && addedAlone.flow >= lowBand.flowMin;
      expect(candidate.set!.stopped[1].meetsMinimum).to.equal(true);
      expect(candidate.set!.stopped[0].meetsMinimum).to.equal(reaches);
      expect(candidate.misses.includes('redundancy')).to.equal(!reaches);
    }
    // in band, a candidate missing more requirements never ranks above one missing fewer
    const inBand = answer.candidates.filter((candidate) => candidate.inBand);
    for (let at = 1; at < inBand.length; at += 1)
      expect(inBand[at - 1].misses.length).to.be.at.most(inBand[at].misses.length);
  });

  it('takes an inline kept curve the same as the catalog pump of that curve', async () => {
    const curve = syntheticCurve(keptShape).map((point) => ({
      flow: flowFromSI(point.flow, 'gpm'),
      head: headFromSI(point.head, 'ft'),
      efficiency: point.efficiency! * 100,
    }));
    const [inline, catalog] = await Promise.all([
      post('/selections', search({ keep: { pump: { curve }, running: 1 }, limit: 3 })).expect(200),
      post('/selections', search({ limit: 3 })).expect(200),
    ]);
    const [a, b] = [inline.body.candidates[0] as SelectionCandidate, catalog.body.candidates[0] as SelectionCandidate];
    expect(a.pumpId).to.equal(b.pumpId);
    expect(a.set!.pumps[0].pumpId).to.equal(null);
    expect(a.set!.flow).to.be.closeTo(b.set!.flow, 1e-6 * b.set!.flow);
  });

  it('answers the contract example keep-existing with a body its schema accepts', async () => {
    const operation = (openApiDocument.paths?.['/selections'] as OpenAPIV3_1.PathItemObject)
      .post as OpenAPIV3_1.OperationObject;
    const media = (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'];
    const example = (media.examples?.['keep-existing'] as OpenAPIV3_1.ExampleObject).value as Record<string, unknown>;
    const response = await post('/selections', { ...example, keep: { pump: { pumpId: keptId } } }).expect(200);
    const validate = contractSchemaValidator('SelectionResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    expect(response.body.candidates[0].set.pumps[0].pumpId).to.equal(keptId);
  });

  it('leaves out, and says so, a pump whose curve does not start at zero flow', async () => {
    const before = (await post('/selections', search({ limit: 1 })).expect(200)).body as SelectionResponse;
    const pumpId = before.candidates[0].pumpId;
    await scratch.sequelize.query(
      `UPDATE curve_revisions r JOIN pumps p ON p.current_revision_id = r.id
       SET r.fit = JSON_SET(r.fit, '$.flowMin', 0.0002), p.updated_at = NOW() + INTERVAL 1 MINUTE WHERE p.id = ?`,
      { replacements: [pumpId] },
    );
    // past the snapshot's stamp reuse, so the search reads the changed catalog
    snapshotClock.now = () => realClock() + 60_000;
    const after = (await post('/selections', search({ limit: 200 })).expect(200)).body as SelectionResponse;
    expect(after.considered).to.equal(fits.size - 1);
    expect(after.candidates.map((candidate) => candidate.pumpId)).to.not.include(pumpId);
    expect(after.warnings).to.include(
      'catalog pumps left out (1): a curve that does not start at zero flow cannot be set in parallel beside the kept pump',
    );
  });

  const refusals: Array<{ name: string; body: () => object; status: number; pointer: string; under?: true }> = [
    {
      name: 'an unknown kept pump id',
      body: () => search({ keep: { pump: { pumpId: 999_999 } } }),
      status: 422,
      pointer: '/body/keep/pump/pumpId',
    },
    {
      name: 'two in parallel beside the kept pump',
      body: () => search({ arrangements: [1, 2] }),
      status: 422,
      pointer: '/body/arrangements',
    },
    {
      name: 'a standby beside the kept pump',
      body: () => search({ standby: true }),
      status: 422,
      pointer: '/body/standby',
    },
    {
      name: 'a kept curve that rises with flow',
      body: () =>
        search({
          keep: {
            pump: {
              curve: [
                { flow: 0, head: 20 },
                { flow: 50, head: 30 },
                { flow: 100, head: 40 },
              ],
            },
          },
        }),
      status: 422,
      pointer: '/body/keep/pump/curve',
      under: true,
    },
    {
      name: 'a kept curve that starts above zero flow',
      body: () =>
        search({
          keep: {
            pump: {
              curve: [
                { flow: 20, head: 30 },
                { flow: 60, head: 26 },
                { flow: 100, head: 15 },
              ],
            },
          },
        }),
      status: 422,
      pointer: '/body/keep/pump',
    },
    {
      name: 'two kept pumps running',
      body: () => search({ keep: { pump: { pumpId: keptId }, running: 2 } }),
      status: 400,
      pointer: '/body/keep/running',
    },
  ];
  for (const { name, body, status, pointer, under } of refusals) {
    it(`answers ${status} naming ${pointer}${under ? '/...' : ''} for ${name}`, async () => {
      const response = await post('/selections', body());
      expect(response.status, JSON.stringify(response.body)).to.equal(status);
      expect(response.type).to.equal('application/problem+json');
      if (under) expect(response.body.pointer.startsWith(`${pointer}/`), response.body.pointer).to.equal(true);
      else expect(response.body.pointer).to.equal(pointer);
    });
  }
});
