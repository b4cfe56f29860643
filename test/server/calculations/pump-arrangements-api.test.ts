import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { waterDensity } from '../../../shared/hydraulics';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog } from '../selection/synthetic-catalog';

/*
 * Mixed sets (different models in parallel) and identical pumps in series through the API, against
 * figures worked out here, not by the engine's solver:
 * - closed form: pumps H = a - b Q^2 on a system H0 + k Q^2 (the system's only loss an equipment
 *   item, K constant, on a 1 cm stub of 500 mm pipe whose friction, under 1e-7 m, is below the
 *   tolerance). Series of n: n (a - b Q^2) = H0 + k Q^2. Two unequal pumps in parallel at common
 *   head H: sqrt(u) + sqrt(v) = sqrt(w) with u = (a1 - H)/b1, v = (a2 - H)/b2, w = (H - H0)/k,
 *   squared twice: 4 u v = (w - u - v)^2, a quadratic in H;
 * - brute force: the system curve from POST /calculations/system-curve on a grid of flows, the pump
 *   heads from their known formulas, the crossing found by scanning the grid for the sign change
 *   and scanning again, finer, inside it.
 * No published worked example with reproducible numbers was at hand for unequal pumps in parallel
 * or pumps in series, so none is quoted.
 */

const units = { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm', power: 'W' } as const;

/** H = a - b Q^2 (m, L/s), published at five flows up to `last`, with an efficiency hump. */
function quadraticPump(a: number, b: number, last: number, efficiencies: number[]) {
  return {
    curve: [0, 0.25, 0.5, 0.75, 1].map((share, index) => ({
      flow: share * last,
      head: a - b * (share * last) ** 2,
      efficiency: efficiencies[index],
    })),
  };
}

const pumpA = { a: 10, b: 0.125 };
const pumpB = { a: 8, b: 0.2 };
const inlineA = quadraticPump(pumpA.a, pumpA.b, 8, [0, 40, 60, 62, 50]);
const inlineB = quadraticPump(pumpB.a, pumpB.b, 6, [0, 35, 55, 58, 45]);

/** H0 = 3 m, k = 2 m / (5 L/s)^2 = 0.08 m/(L/s)^2. */
const quadraticSystem = {
  staticHead: 3,
  frictionMethod: 'hazen-williams',
  waterTemperatureC: 20,
  segments: [
    {
      length: 0.01,
      insideDiameter: 500,
      hazenWilliamsC: 150,
      equipment: [{ name: 'filter', headLoss: 2, atFlow: 5 }],
    },
  ],
};
const system = { H0: 3, k: 0.08 };

/** A pond return: 3 m static, 40 m of 50 mm pipe, a filter. */
const pondSystem = {
  staticHead: 3,
  frictionMethod: 'hazen-williams',
  waterTemperatureC: 20,
  segments: [
    {
      length: 40,
      insideDiameter: 50,
      hazenWilliamsC: 150,
      equipment: [{ name: 'filter', headLoss: 0.5, atFlow: 5 }],
    },
  ],
};

/** The roots of A x^2 + B x + C = 0. */
function quadraticRoots(A: number, B: number, C: number): number[] {
  const disc = Math.sqrt(B * B - 4 * A * C);
  return [(-B - disc) / (2 * A), (-B + disc) / (2 * A)];
}

/** Closed form: the common head of two quadratic pumps in parallel on H0 + k Q^2 (see the note at the top). */
function parallelPairHead(p1: { a: number; b: number }, p2: { a: number; b: number }): number {
  // u = (a1 - H)/b1 = u0 + u1 H, likewise v and w; 4 u v - (w - u - v)^2 = 0
  const [u0, u1] = [p1.a / p1.b, -1 / p1.b];
  const [v0, v1] = [p2.a / p2.b, -1 / p2.b];
  const [w0, w1] = [-system.H0 / system.k, 1 / system.k];
  const [d0, d1] = [w0 - u0 - v0, w1 - u1 - v1];
  const A = 4 * u1 * v1 - d1 * d1;
  const B = 4 * (u0 * v1 + u1 * v0) - 2 * d0 * d1;
  const C = 4 * u0 * v0 - d0 * d0;
  const valid = quadraticRoots(A, B, C).filter((H) => H > system.H0 && H < Math.min(p1.a, p2.a) && d0 + d1 * H >= 0);
  expect(valid, 'one root in range').to.have.length(1);
  return valid[0];
}

describe('mixed sets and pumps in series at the operating point', function () {
  this.timeout(60_000);
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;
  let catalogPumpId: number;
  /** The catalog pump's shape: H = 9 (1 - 0.2 x - 0.6 x^2), eta = 0.6 (2 x / 0.6 - (x / 0.6)^2), x = Q / 6 L/s. */
  const catalogHead = (flow: number) => 9 * (1 - 0.2 * (flow / 6) - 0.6 * (flow / 6) ** 2);
  const catalogEfficiency = (flow: number) => 0.6 * ((2 * flow) / 6 / 0.6 - (flow / 6 / 0.6) ** 2);

  before(async () => {
    scratch = await createScratchDatabase('pump_arrangements');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    [catalogPumpId] = await seedSyntheticCatalog(
      scratch.sequelize,
      [{ shutOffHead: 9, lastFlow: 0.006, peakEfficiency: 0.6 }],
      'Arrangement Test Pumps',
      'submersible',
    );
  });

  after(async () => {
    await scratch?.drop();
  });

  function post(path: string, body: unknown) {
    return request(app)
      .post(`/api/v1${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);
  }

  const validateAnswer = contractSchemaValidator('OperatingPointResponse');

  async function operatingPoint(body: Record<string, unknown>) {
    const response = await post('/calculations/operating-point', { units, ...body });
    expect(response.status, JSON.stringify(response.body)).to.equal(200);
    expect(validateAnswer(response.body), JSON.stringify(validateAnswer.errors)).to.equal(true);
    return response.body;
  }

  /** System head (m) at each flow (L/s), from the system-curve endpoint. */
  async function systemHeads(pipeSystem: unknown, flows: number[]): Promise<number[]> {
    const response = await post('/calculations/system-curve', { units, system: pipeSystem, flows }).expect(200);
    return (response.body.points as Array<{ head: number }>).map((point) => point.head);
  }

  /** The flow where `surplus(flow, systemHead)` changes sign from + to -, scanning [lo, hi] twice. */
  async function bruteForceCrossing(
    pipeSystem: unknown,
    surplus: (flow: number, head: number) => number,
    lo: number,
    hi: number,
  ): Promise<number> {
    for (let pass = 0; pass < 2; pass++) {
      const flows = Array.from({ length: 500 }, (_, index) => lo + ((hi - lo) * index) / 499);
      const heads = await systemHeads(pipeSystem, flows);
      const values = flows.map((flow, index) => surplus(flow, heads[index]));
      const at = values.findIndex((value, index) => index > 0 && values[index - 1] > 0 && value <= 0);
      expect(at, `a sign change on the grid: ${values.slice(0, 3).join()} ... ${values.slice(-3).join()}`).to.be.above(
        0,
      );
      [lo, hi] = [flows[at - 1], flows[at]];
      if (pass === 1) return lo + ((hi - lo) * values[at - 1]) / (values[at - 1] - values[at]);
    }
    throw new Error('unreachable');
  }

  /** Flow (L/s) of a - b Q^2 at head H, 0 at or above shut-off. */
  const quadraticFlowAt = (pump: { a: number; b: number }, head: number) =>
    head >= pump.a ? 0 : Math.sqrt((pump.a - head) / pump.b);
  /** Flow (L/s) of the catalog pump at head H: 9 (1 - 0.2 x - 0.6 x^2) = H solved for x. */
  const catalogFlowAt = (head: number) => {
    if (head >= 9) return 0;
    return Math.max(...quadraticRoots(-0.6, -0.2, 1 - head / 9)) * 6;
  };

  describe('a mixed set (pumps)', () => {
    it('meets the closed form for two different quadratic pumps in parallel', async () => {
      const answer = await operatingPoint({
        system: quadraticSystem,
        pumps: [
          { pump: inlineA, running: 1 },
          { pump: inlineB, running: 1 },
        ],
      });
      const head = parallelPairHead(pumpA, pumpB);
      const [flowA, flowB] = [quadraticFlowAt(pumpA, head), quadraticFlowAt(pumpB, head)];
      expect(answer.layout).to.equal('parallel');
      expect(answer.operatingPoint.head).to.be.closeTo(head, 1e-4);
      expect(answer.operatingPoint.flow).to.be.closeTo(flowA + flowB, 1e-4);
      expect(answer.operatingPoint.flow).to.be.closeTo(Math.sqrt((head - system.H0) / system.k), 1e-4);
      const [a, b] = answer.operatingPoint.pumps;
      expect(a).to.include({ entry: 0, running: 1 });
      expect(b).to.include({ entry: 1, running: 1 });
      expect(a.flow).to.be.closeTo(flowA, 1e-4);
      expect(b.flow).to.be.closeTo(flowB, 1e-4);
      expect(a.head).to.be.closeTo(head, 1e-4);
      expect(b.head).to.be.closeTo(head, 1e-4);
      expect(answer.fits).to.have.length(2);
      expect(answer.fit).to.deep.equal(answer.fits[0]);
      expect(answer.fits[1].shutOffHead).to.be.closeTo(pumpB.a, 1e-9);
      for (const [index, entry] of answer.operatingPoint.pumps.entries()) {
        expect(entry.percentOfBep).to.be.closeTo((100 * entry.flow) / answer.fits[index].bep.flow, 1e-6);
      }
      // inline curves' power as published: the shaft power of each pump, rho g Q H / eta
      const rhoG = waterDensity(20) * 9.80665;
      expect(a.inputPower).to.be.closeTo((rhoG * (a.flow / 1000) * a.head) / (a.efficiency / 100), 1e-6);
      expect(answer.operatingPoint.inputPower).to.be.closeTo(a.inputPower + b.inputPower, 1e-9);
    });

    it('takes two of one model in an entry: per pump Q/2 on that entry (closed form)', async () => {
      const answer = await operatingPoint({
        system: quadraticSystem,
        pumps: [
          { pump: inlineA, running: 1 },
          { pump: inlineB, running: 2 },
        ],
      });
      // two of B in parallel are a - (b/4) Q^2
      const head = parallelPairHead(pumpA, { a: pumpB.a, b: pumpB.b / 4 });
      const [entryA, entryB] = answer.operatingPoint.pumps;
      expect(answer.operatingPoint.head).to.be.closeTo(head, 1e-4);
      expect(entryB.running).to.equal(2);
      expect(entryA.flow).to.be.closeTo(quadraticFlowAt(pumpA, head), 1e-4);
      expect(entryB.flow).to.be.closeTo(quadraticFlowAt(pumpB, head), 1e-4);
      expect(answer.operatingPoint.flow).to.be.closeTo(entryA.flow + 2 * entryB.flow, 1e-9);
      expect(answer.operatingPoint.inputPower).to.be.closeTo(entryA.inputPower + 2 * entryB.inputPower, 1e-9);
    });

    it('gives the worst single failure as oneFailed: here the larger pump stopped, the smaller alone', async () => {
      const answer = await operatingPoint({
        system: quadraticSystem,
        pumps: [
          { pump: inlineA, running: 1 },
          { pump: inlineB, running: 1 },
        ],
      });
      // each alone: a - b Q^2 = H0 + k Q^2
      const aloneB = Math.sqrt((pumpB.a - system.H0) / (pumpB.b + system.k));
      const aloneA = Math.sqrt((pumpA.a - system.H0) / (pumpA.b + system.k));
      expect(aloneB).to.be.below(aloneA);
      expect(answer.oneFailed.flow).to.be.closeTo(aloneB, 1e-4);
      expect(answer.oneFailed.pumps).to.have.length(1);
      expect(answer.oneFailed.pumps[0]).to.include({ entry: 1, running: 1 });
      expect(answer.oneFailed.pumps[0].flow).to.be.closeTo(aloneB, 1e-4);
    });

    it('meets a brute-force scan for an inline pump beside a catalog pump on a real pipe', async () => {
      const answer = await operatingPoint({
        system: pondSystem,
        pumps: [
          { pump: inlineA, running: 1 },
          { pump: { pumpId: catalogPumpId }, running: 1 },
        ],
      });
      const flow = await bruteForceCrossing(
        pondSystem,
        (total, head) => quadraticFlowAt(pumpA, head) + catalogFlowAt(head) - total,
        0.1,
        14,
      );
      const [systemHead] = await systemHeads(pondSystem, [flow]);
      expect(answer.operatingPoint.flow).to.be.closeTo(flow, 1e-3);
      expect(answer.operatingPoint.head).to.be.closeTo(systemHead, 1e-3);
      const [inline, catalog] = answer.operatingPoint.pumps;
      expect(inline.flow).to.be.closeTo(quadraticFlowAt(pumpA, systemHead), 1e-3);
      expect(catalog.flow).to.be.closeTo(catalogFlowAt(systemHead), 1e-3);
      expect(catalog.head).to.be.closeTo(catalogHead(catalog.flow), 1e-3);
      // wire-to-water: the catalog pump's shaft power over the submersible kind's 0.7 motor efficiency
      const rhoG = waterDensity(20) * 9.80665;
      const shaft = (rhoG * (catalog.flow / 1000) * catalog.head) / catalogEfficiency(catalog.flow);
      expect(catalog.inputPower).to.be.closeTo(shaft / 0.7, shaft * 1e-3);
      expect(catalog.efficiency).to.be.closeTo(100 * catalogEfficiency(catalog.flow), 1e-2);
    });

    it('reports a pump that cannot reach the common head as delivering nothing', async () => {
      const weak = { a: 4, b: 0.2 };
      const answer = await operatingPoint({
        system: quadraticSystem,
        pumps: [
          { pump: inlineA, running: 1 },
          { pump: quadraticPump(weak.a, weak.b, 4, [0, 35, 55, 58, 45]), running: 1 },
        ],
      });
      // A alone reaches a head above the weak pump's 4 m shut-off
      const aloneA = Math.sqrt((pumpA.a - system.H0) / (pumpA.b + system.k));
      expect(system.H0 + system.k * aloneA ** 2).to.be.above(weak.a);
      expect(answer.operatingPoint.flow).to.be.closeTo(aloneA, 1e-4);
      expect(answer.operatingPoint.pumps[1].flow).to.equal(0);
      expect(answer.operatingPoint.pumps[1].head).to.be.closeTo(weak.a, 1e-9);
      expect(answer.warnings.join(' ')).to.contain('pumps[1] delivers nothing').and.contain('4 m');
    });
  });

  describe('a mixed set with a suction side', () => {
    it('checks NPSH per entry: available at the total flow, required at the flow of each pump', async () => {
      const suctionSystem = {
        ...pondSystem,
        siteElevation: 300,
        pumpElevation: 1.5,
        segments: [{ length: 4, insideDiameter: 80, hazenWilliamsC: 150, side: 'suction' }, ...pondSystem.segments],
      };
      // NPSH3 = 1 + 0.25 Q (m, L/s) on A, 2 + 0.5 Q on B
      const withNpsh = (pump: typeof inlineA, n0: number, n1: number) => ({
        curve: pump.curve.map((point) => ({ ...point, npshRequired: n0 + n1 * point.flow })),
      });
      const answer = await operatingPoint({
        system: suctionSystem,
        pumps: [
          { pump: withNpsh(inlineA, 1, 0.25), running: 1 },
          { pump: withNpsh(inlineB, 2, 0.5), running: 1 },
        ],
      });
      const curveAtTotal = await post('/calculations/system-curve', {
        units,
        system: suctionSystem,
        flows: [answer.operatingPoint.flow],
      }).expect(200);
      const available = curveAtTotal.body.points[0].npshAvailable;
      const [a, b] = answer.operatingPoint.pumps;
      expect(a.npsh.available).to.be.closeTo(available, 1e-9);
      expect(b.npsh.available).to.be.closeTo(available, 1e-9);
      expect(a.npsh.required).to.be.closeTo(1 + 0.25 * a.flow, 1e-6);
      expect(b.npsh.required).to.be.closeTo(2 + 0.5 * b.flow, 1e-6);
      expect(answer).to.not.have.property('npsh');
    });
  });

  describe('pumps in series (arrangement.layout: series)', () => {
    it('meets the closed form for two quadratic pumps: each carries the full flow and half the head', async () => {
      const answer = await operatingPoint({
        system: quadraticSystem,
        pump: inlineA,
        arrangement: { installed: 2, running: 2, layout: 'series' },
      });
      const flow = Math.sqrt((2 * pumpA.a - system.H0) / (2 * pumpA.b + system.k));
      const head = system.H0 + system.k * flow * flow;
      expect(answer.layout).to.equal('series');
      expect(answer.operatingPoint.flow).to.be.closeTo(flow, 1e-4);
      expect(answer.operatingPoint.flowPerPump).to.be.closeTo(flow, 1e-4);
      expect(answer.operatingPoint.head).to.be.closeTo(head, 1e-4);
      expect(answer.operatingPoint.headPerPump).to.be.closeTo(head / 2, 1e-4);
      expect(answer.operatingPoint.headPerPump).to.be.closeTo(pumpA.a - pumpA.b * flow * flow, 1e-4);
      // two pumps, each at the full flow and half the head: twice one pump's shaft power
      const rhoG = waterDensity(20) * 9.80665;
      const perPump = (rhoG * (flow / 1000) * (head / 2)) / (answer.operatingPoint.efficiency / 100);
      expect(answer.operatingPoint.inputPower).to.be.closeTo(2 * perPump, perPump * 1e-3);
      // one failed: the other pump alone, a - b Q^2 = H0 + k Q^2
      const alone = Math.sqrt((pumpA.a - system.H0) / (pumpA.b + system.k));
      expect(answer.oneFailed.flow).to.be.closeTo(alone, 1e-4);
      expect(answer.oneFailed.flow).to.be.below(answer.operatingPoint.flow);
    });

    it('meets a brute-force scan for three catalog pumps in series on a real pipe', async () => {
      const tall = { ...pondSystem, staticHead: 14 };
      const answer = await operatingPoint({
        system: tall,
        pump: { pumpId: catalogPumpId },
        arrangement: { installed: 3, running: 3, layout: 'series' },
      });
      const flow = await bruteForceCrossing(tall, (q, head) => 3 * catalogHead(q) - head, 0.01, 6);
      const [systemHead] = await systemHeads(tall, [flow]);
      expect(answer.operatingPoint.flow).to.be.closeTo(flow, 1e-3);
      expect(answer.operatingPoint.head).to.be.closeTo(systemHead, 1e-3);
      expect(answer.operatingPoint.headPerPump).to.be.closeTo(catalogHead(flow), 1e-3);
      // one failed: two in series
      const two = await bruteForceCrossing(tall, (q, head) => 2 * catalogHead(q) - head, 0.01, 6);
      expect(answer.oneFailed.flow).to.be.closeTo(two, 1e-3);
      expect(answer.oneFailed.headPerPump).to.be.closeTo(catalogHead(two), 1e-3);
    });
  });

  describe('balancing pumps in series on a branched system', () => {
    it('gives the valve K that, added on the other branch, gives the named branch its flow', async () => {
      const branchedSystem = (extraK: number) => ({
        frictionMethod: 'hazen-williams',
        waterTemperatureC: 20,
        segments: [{ length: 6, insideDiameter: 80, hazenWilliamsC: 150 }],
        branches: [
          {
            name: 'falls',
            staticHead: 9,
            segments: [{ length: 20, insideDiameter: 50, hazenWilliamsC: 150, minorLossK: 2 }],
          },
          {
            name: 'spray',
            staticHead: 4,
            segments: [{ length: 10, insideDiameter: 50, hazenWilliamsC: 150, minorLossK: 8 + extraK }],
          },
        ],
      });
      const series = { installed: 2, running: 2, layout: 'series' };
      const balanced = await operatingPoint({
        system: branchedSystem(0),
        pump: inlineA,
        arrangement: series,
        balance: { branch: 'falls', flow: 5 },
      });
      expect(balanced.balancing.valvesOn).to.deep.equal(['spray']);
      const valved = await operatingPoint({
        system: branchedSystem(balanced.balancing.valveK),
        pump: inlineA,
        arrangement: series,
      });
      const falls = valved.operatingPoint.branches.find((branch: { name: string }) => branch.name === 'falls');
      expect(falls.flow).to.be.closeTo(5, 1e-3);
      expect(valved.operatingPoint.headPerPump).to.be.closeTo(valved.operatingPoint.head / 2, 1e-9);
    });
  });

  describe('a single catalog pump', () => {
    it('gives its input power wire-to-water, as a mixed set and the selection do', async () => {
      const answer = await operatingPoint({ system: pondSystem, pump: { pumpId: catalogPumpId } });
      const point = answer.operatingPoint;
      const rhoG = waterDensity(20) * 9.80665;
      const shaft = (rhoG * (point.flow / 1000) * point.head) / catalogEfficiency(point.flow);
      expect(answer.layout).to.equal('parallel');
      expect(point.inputPower).to.be.closeTo(shaft / 0.7, shaft * 1e-3);
    });
  });

  describe('bad input: a 4xx naming the field, nothing written', () => {
    async function rowCounts(): Promise<Record<string, number>> {
      const tables = await scratch.sequelize.query<{ name: string }>(
        'SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()',
        { type: QueryTypes.SELECT },
      );
      const counts: Record<string, number> = {};
      for (const { name } of tables) {
        const [row] = await scratch.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${name}\``, {
          type: QueryTypes.SELECT,
        });
        counts[name] = Number(row.n);
      }
      return counts;
    }

    const cases: Array<[string, () => Record<string, unknown>, number, string]> = [
      [
        'five entries in a mixed set',
        () => ({ system: quadraticSystem, pumps: Array.from({ length: 5 }, () => ({ pump: inlineB, running: 1 })) }),
        400,
        '/body/pumps',
      ],
      [
        'five pumps in all in a mixed set',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 3 },
            { pump: inlineB, running: 2 },
          ],
        }),
        422,
        '/body/pumps',
      ],
      [
        'pumps in series with one pump',
        () => ({ system: quadraticSystem, pump: inlineA, arrangement: { installed: 1, running: 1, layout: 'series' } }),
        422,
        '/body/arrangement/running',
      ],
      [
        'pumps in series with a standby',
        () => ({ system: quadraticSystem, pump: inlineA, arrangement: { installed: 3, running: 2, layout: 'series' } }),
        422,
        '/body/arrangement/installed',
      ],
      [
        'both pump and pumps',
        () => ({
          system: quadraticSystem,
          pump: inlineA,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: inlineB, running: 1 },
          ],
        }),
        422,
        '/body/pumps',
      ],
      ['neither pump nor pumps', () => ({ system: quadraticSystem }), 422, '/body/pump'],
      [
        'an unknown pumpId in a mixed set',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: { pumpId: catalogPumpId + 1000 }, running: 1 },
          ],
        }),
        404,
        '/body/pumps/1/pump/pumpId',
      ],
      [
        'an arrangement beside a mixed set',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: inlineB, running: 1 },
          ],
          arrangement: { installed: 2, running: 2 },
        }),
        422,
        '/body/arrangement',
      ],
      [
        'balancing beside a mixed set',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: inlineB, running: 1 },
          ],
          balance: { branch: 'falls', flow: 2 },
        }),
        422,
        '/body/balance',
      ],
      [
        'a mixed-set curve that does not start at zero flow',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: { curve: inlineB.curve.slice(1) }, running: 1 },
          ],
        }),
        422,
        '/body/pumps/1/pump',
      ],
      [
        'a bad curve point in a mixed set, in the request units',
        () => ({
          system: quadraticSystem,
          pumps: [
            { pump: inlineA, running: 1 },
            { pump: { curve: [...inlineB.curve.slice(0, 4), { flow: 6, head: 9 }] }, running: 1 },
          ],
        }),
        422,
        '/body/pumps/1/pump/curve',
      ],
    ];

    for (const [what, body, status, pointer] of cases) {
      it(`refuses ${what} (${status} at ${pointer})`, async () => {
        const before = await rowCounts();
        const response = await post('/calculations/operating-point', { units, ...body() });
        expect(response.status, JSON.stringify(response.body)).to.equal(status);
        expect(response.headers['content-type']).to.contain('application/problem+json');
        const pointers = (response.body.errors as Array<{ pointer: string }>).map((error) => error.pointer);
        expect(
          pointers.some((at) => at.startsWith(pointer)),
          pointers.join(', '),
        ).to.equal(true);
        expect(await rowCounts()).to.deep.equal(before);
      });
    }
  });
});
