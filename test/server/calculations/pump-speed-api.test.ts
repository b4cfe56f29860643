import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog } from '../selection/synthetic-catalog';

/*
 * The operating point at a speed, through the API, against an independent closed-form solve (no
 * published worked example with reproducible numbers was at hand): a pump H = a - b Q^2 moved to
 * speed ratio r by the affinity laws is H = r^2 a - b Q^2 (H'(Q) = r^2 H(Q/r)), and on a system
 * H0 + k Q^2 it settles at Q = sqrt((r^2 a - H0) / (b + k)). The system's only loss is an
 * equipment item (K constant) on a 1 cm stub of 500 mm pipe whose friction is below the tolerance.
 */

const units = { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm', power: 'W' } as const;

function quadraticPump(a: number, b: number, last: number) {
  return {
    curve: [0, 0.25, 0.5, 0.75, 1].map((share, index) => ({
      flow: share * last,
      head: a - b * (share * last) ** 2,
      efficiency: [0, 40, 60, 62, 50][index],
    })),
  };
}

const pump = { a: 20, b: 0.25 };
const inline = quadraticPump(pump.a, pump.b, 8);

/** H0 = 3 m, k = 2 m / (5 L/s)^2 = 0.08 m/(L/s)^2. */
const quadraticSystem = {
  staticHead: 3,
  frictionMethod: 'hazen-williams',
  waterTemperatureC: 20,
  segments: [
    { length: 0.01, insideDiameter: 500, hazenWilliamsC: 150, equipment: [{ name: 'filter', headLoss: 2, atFlow: 5 }] },
  ],
};
const closedFormFlow = (ratio: number) => Math.sqrt((ratio * ratio * pump.a - 3) / (pump.b + 0.08));

describe('the operating point at a speed (speed: ratio or rpm)', function () {
  this.timeout(60_000);
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;
  let rangedPumpId: number;
  let twoSpeedPumpId: number;
  let fixedPumpId: number;

  before(async () => {
    scratch = await createScratchDatabase('pump_speed');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    [rangedPumpId, twoSpeedPumpId, fixedPumpId] = await seedSyntheticCatalog(
      scratch.sequelize,
      [
        { shutOffHead: 16, lastFlow: 0.006, peakEfficiency: 0.6 },
        { shutOffHead: 16, lastFlow: 0.006, peakEfficiency: 0.6 },
        { shutOffHead: 16, lastFlow: 0.006, peakEfficiency: 0.6 },
      ],
      'Speed Test Pumps',
    );
    // a drive's range on the first, a two-speed motor on the second, the third fixed at 2900 rpm
    await scratch.sequelize.query(
      `UPDATE pumps SET nominal_speed_rpm = 2900,
         speed_min_rpm = IF(id = ?, 1450, NULL), speed_max_rpm = IF(id = ?, 2900, NULL),
         fixed_speeds_rpm = IF(id = ?, '1450;2900', NULL) WHERE id IN (?, ?, ?)`,
      { replacements: [rangedPumpId, rangedPumpId, twoSpeedPumpId, rangedPumpId, twoSpeedPumpId, fixedPumpId] },
    );
  });

  after(async () => {
    await scratch?.drop();
  });

  function post(body: Record<string, unknown>) {
    return request(app)
      .post('/api/v1/calculations/operating-point')
      .set('Authorization', `Bearer ${token}`)
      .send({ units, ...body });
  }

  const validateAnswer = contractSchemaValidator('OperatingPointResponse');

  async function operatingPoint(body: Record<string, unknown>) {
    const response = await post(body);
    expect(response.status, JSON.stringify(response.body)).to.equal(200);
    expect(validateAnswer(response.body), JSON.stringify(validateAnswer.errors)).to.equal(true);
    return response.body;
  }

  it('moves an inline curve to a speed ratio: the point and the curve match the closed form', async () => {
    const answer = await operatingPoint({ system: quadraticSystem, pump: inline, speed: { ratio: 0.8 } });
    expect(answer.operatingPoint.flow).to.be.closeTo(closedFormFlow(0.8), 2e-3);
    expect(answer.operatingPoint.head).to.be.closeTo(0.64 * pump.a - pump.b * closedFormFlow(0.8) ** 2, 2e-3);
    expect([answer.speed.ratio, answer.speed.rpm, answer.speed.nominalRpm]).to.deep.equal([0.8, null, null]);
    expect(answer.speed.cautions).to.deep.equal([]);
    // H = r^2 a - b Q^2 over the published range moved to r: 0 to 0.8 x 8 L/s
    expect(answer.speed.curve.at(-1).flow).to.be.closeTo(6.4, 1e-6);
    for (const point of answer.speed.curve as Array<{ flow: number; head: number }>)
      expect(point.head, `at ${point.flow}`).to.be.closeTo(0.64 * pump.a - pump.b * point.flow ** 2, 1e-3);
    expect(answer.fit.shutOffHead).to.be.closeTo(0.64 * pump.a, 1e-3);
    expect(answer.fit.warnings.join(' ')).to.contain('scaled to 80.0 % speed');
  });

  it('holds the efficiency at similar points: BEP flow x r, BEP head x r^2, the same BEP efficiency', async () => {
    const nominal = await operatingPoint({ system: quadraticSystem, pump: inline });
    const slowed = await operatingPoint({ system: quadraticSystem, pump: inline, speed: { ratio: 0.8 } });
    expect(slowed.fit.bep.flow).to.be.closeTo(0.8 * nominal.fit.bep.flow, 1e-9);
    expect(slowed.fit.bep.head).to.be.closeTo(0.64 * nominal.fit.bep.head, 1e-9);
    expect(slowed.fit.bep.efficiency).to.be.closeTo(nominal.fit.bep.efficiency, 1e-9);
  });

  it('takes rpm against the inline curve`s speedRpm and cautions below 60 % speed', async () => {
    const answer = await operatingPoint({
      system: quadraticSystem,
      pump: { ...inline, speedRpm: 2900 },
      speed: { rpm: 1450 },
    });
    expect([answer.speed.ratio, answer.speed.rpm, answer.speed.nominalRpm]).to.deep.equal([0.5, 1450, 2900]);
    expect(answer.operatingPoint.flow).to.be.closeTo(closedFormFlow(0.5), 2e-3);
    expect(answer.speed.cautions).to.deep.equal(['low-speed']);
    expect(answer.warnings.join(' ')).to.contain('at 50.0 % speed, below 60 %');
  });

  it('runs a catalog pump within its range or at a fixed speed, the nominal speed read from the catalog', async () => {
    const ranged = await operatingPoint({
      system: quadraticSystem,
      pump: { pumpId: rangedPumpId },
      speed: { rpm: 2175 },
    });
    expect([ranged.speed.ratio, ranged.speed.rpm, ranged.speed.nominalRpm]).to.deep.equal([0.75, 2175, 2900]);
    const full = await operatingPoint({ system: quadraticSystem, pump: { pumpId: rangedPumpId } });
    expect(ranged.operatingPoint.flow).to.be.below(full.operatingPoint.flow);
    expect(ranged.fit.shutOffHead).to.be.closeTo(0.5625 * full.fit.shutOffHead, 1e-6);
    const twoSpeed = await operatingPoint({
      system: quadraticSystem,
      pump: { pumpId: twoSpeedPumpId },
      speed: { ratio: 0.5 },
    });
    expect(twoSpeed.speed.rpm).to.equal(1450);
    expect(twoSpeed.fit.shutOffHead).to.be.closeTo(0.25 * full.fit.shutOffHead, 1e-6);
  });

  describe('bad input: a 4xx naming the field, nothing written', () => {
    async function rowCounts(): Promise<number[]> {
      const counts: number[] = [];
      for (const table of ['pumps', 'curve_revisions', 'projects', 'audit_events']) {
        const [row] = await scratch.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, {
          type: QueryTypes.SELECT,
        });
        counts.push(Number(row.n));
      }
      return counts;
    }

    const cases: Array<[string, () => Record<string, unknown>, number, string, string?]> = [
      ['a speed ratio of 0', () => ({ pump: inline, speed: { ratio: 0 } }), 400, '/body/speed/ratio'],
      ['a speed ratio above 1.2', () => ({ pump: inline, speed: { ratio: 1.3 } }), 400, '/body/speed/ratio'],
      ['rpm without a nominal speed', () => ({ pump: inline, speed: { rpm: 1450 } }), 422, '/body/speed/rpm'],
      ['both ratio and rpm', () => ({ pump: inline, speed: { ratio: 0.8, rpm: 1450 } }), 422, '/body/speed/rpm'],
      ['neither ratio nor rpm', () => ({ pump: inline, speed: {} }), 422, '/body/speed'],
      [
        'a catalog pump below its range',
        () => ({ pump: { pumpId: rangedPumpId }, speed: { rpm: 1000 } }),
        422,
        '/body/speed/rpm',
        '1450-2900 rpm',
      ],
      [
        'a catalog pump above its range',
        () => ({ pump: { pumpId: rangedPumpId }, speed: { ratio: 1.1 } }),
        422,
        '/body/speed/ratio',
        '1450-2900 rpm',
      ],
      [
        'a two-speed pump between its speeds',
        () => ({ pump: { pumpId: twoSpeedPumpId }, speed: { ratio: 0.75 } }),
        422,
        '/body/speed/ratio',
        '1450, 2900 rpm',
      ],
      [
        'a fixed-speed catalog pump at another speed',
        () => ({ pump: { pumpId: fixedPumpId }, speed: { ratio: 0.9 } }),
        422,
        '/body/speed/ratio',
        'only its nominal 2900 rpm',
      ],
      [
        'a speed beside a mixed set',
        () => ({
          pumps: [
            { pump: inline, running: 1 },
            { pump: quadraticPump(10, 0.125, 8), running: 1 },
          ],
          speed: { ratio: 0.8 },
        }),
        422,
        '/body/speed',
      ],
    ];

    for (const [what, body, status, pointer, detail] of cases) {
      it(`refuses ${what} (${status} at ${pointer})`, async () => {
        const before = await rowCounts();
        const response = await post({ system: quadraticSystem, ...body() });
        expect(response.status, JSON.stringify(response.body)).to.equal(status);
        expect(response.headers['content-type']).to.contain('application/problem+json');
        const errors = response.body.errors as Array<{ pointer: string; detail: string }>;
        expect(
          errors.map((error) => error.pointer),
          JSON.stringify(errors),
        ).to.include(pointer);
        if (detail) expect(errors.map((error) => error.detail).join(' ')).to.contain(detail);
        expect(await rowCounts()).to.deep.equal(before);
      });
    }
  });
});
