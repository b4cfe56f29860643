import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { DesignDraft, ProjectRecheck, SelectionResponse } from '../../../shared/api/api-schemas';
import { designPipeSystem } from '../../../shared/api/design-system';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog } from './synthetic-catalog';

/*
 * The search runs a variable-speed pump at the lowest speed whose point reaches the band's bottom
 * flow, and a multi-speed pump at the lowest of its speeds at or above that, against an independent
 * closed-form solve: the synthetic pump H = H0 (1 - 0.2 x - 0.6 x^2), x = Q / 6 L/s, at speed ratio r
 * is H0 r^2 - 0.2 H0 r (Q/6) - 0.6 H0 (Q/6)^2 (affinity laws, H'(Q) = r^2 H(Q/r)); on the system
 * H0s + k Q^2 (an equipment item on a 1 cm stub of 500 mm pipe) the r putting the point at Q is the
 * root of a quadratic in r, and the point at a given r the root of a quadratic in Q.
 */

const units = { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm', power: 'W' } as const;
const H0 = 16;
const system = {
  staticHead: 3,
  frictionMethod: 'hazen-williams',
  waterTemperatureC: 20,
  segments: [
    { length: 0.01, insideDiameter: 500, hazenWilliamsC: 150, equipment: [{ name: 'filter', headLoss: 2, atFlow: 5 }] },
  ],
};
const systemHead = (flow: number) => 3 + 0.08 * flow * flow;
/** r with H0 r^2 - (0.2 H0 Q/6) r - (0.6 H0 (Q/6)^2 + H_sys(Q)) = 0. */
const ratioForFlow = (flow: number) => {
  const [a, b, c] = [H0, -0.2 * H0 * (flow / 6), -(0.6 * H0 * (flow / 6) ** 2 + systemHead(flow))];
  return (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
};
/** Q with (0.6 H0/36 + 0.08) Q^2 + (0.2 H0 r/6) Q - (H0 r^2 - 3) = 0. */
const flowAtRatio = (r: number) => {
  const [a, b, c] = [(0.6 * H0) / 36 + 0.08, (0.2 * H0 * r) / 6, -(H0 * r * r - 3)];
  return (-b + Math.sqrt(b * b - 4 * a * c)) / (2 * a);
};

describe('POST /api/v1/selections with variable- and multi-speed pumps', function () {
  this.timeout(60_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;
  let ids: number[];
  const validate = contractSchemaValidator('SelectionResponse');

  const search = { units, system, duty: { flowMin: 3, flowMax: 4 }, arrangements: [1], limit: 10 };
  const post = (body: object) =>
    request(app).post('/api/v1/selections').set('Authorization', `Bearer ${token}`).send(body);
  const postTo = (path: string, body?: object) =>
    request(app).post(`/api/v1${path}`).set('Authorization', `Bearer ${token}`).send(body);

  before(async () => {
    scratch = await createScratchDatabase('variable_speed_selection');
    const shape = { shutOffHead: H0, lastFlow: 0.006, peakEfficiency: 0.6 };
    ids = await seedSyntheticCatalog(scratch.sequelize, [shape, shape, shape], 'Speed Search Pumps');
    // a drive's range on the first, a multi-speed motor on the second, the third fixed at 2900 rpm
    await scratch.sequelize.query(
      `UPDATE pumps SET nominal_speed_rpm = 2900, speed_min_rpm = IF(id = ?, 1450, NULL),
         speed_max_rpm = IF(id = ?, 2900, NULL), fixed_speeds_rpm = IF(id = ?, '1450;2175', NULL), updated_at = NOW(3)`,
      { replacements: [ids[0], ids[0], ids[1]] },
    );
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  it('finds the ranged pump at the speed reaching the band bottom, the two-speed one at its next speed up', async () => {
    const body = (await post(search).expect(200)).body as SelectionResponse;
    expect(validate(body), JSON.stringify(validate.errors)).to.equal(true);
    const byId = new Map(body.candidates.map((candidate) => [candidate.pumpId, candidate]));
    const [ranged, twoSpeed, fixed] = ids.map((id) => byId.get(id)!);

    const r = ratioForFlow(3);
    expect(r, 'closed form: within the range and above the low-speed caution').to.be.within(0.6, 1);
    expect(ranged.speed!.ratio).to.be.closeTo(r, 1e-5);
    expect(ranged.speed!.rpm).to.be.closeTo(2900 * r, 0.05);
    expect(ranged.operatingPoint.flow).to.be.closeTo(3, 1e-3);
    expect(ranged.inBand).to.equal(true);
    expect(ranged.warnings).to.not.include('low-speed');

    // 1450 rpm (0.5) is too slow for the band, 2175 rpm (0.75) the next speed up
    expect(twoSpeed.speed).to.deep.equal({ ratio: 0.75, rpm: 2175 });
    expect(twoSpeed.operatingPoint.flow).to.be.closeTo(flowAtRatio(0.75), 1e-3);
    expect(twoSpeed.inBand).to.equal(true);

    // the fixed-speed twin runs past the band at full speed
    expect(fixed.speed).to.equal(null);
    expect(fixed.operatingPoint.flow).to.be.closeTo(flowAtRatio(1), 1e-3);
    expect(fixed.inBand).to.equal(false);

    // the same curve moved by the affinity laws: flows x r, heads x r^2; energy at the speed, less
    const used = ranged.speed!.ratio;
    ranged.curve.forEach((point, at) => {
      expect(point.flow).to.be.closeTo(used * fixed.curve[at].flow, 1e-9);
      expect(point.head).to.be.closeTo(used * used * fixed.curve[at].head, 1e-9);
    });
    expect(ranged.annualKWh!).to.be.below(twoSpeed.annualKWh!);
    expect(twoSpeed.annualKWh!).to.be.below(fixed.annualKWh!);
    expect(body.candidates.map((candidate) => candidate.pumpId)).to.deep.equal(ids);
    expect(ranged.reasons.join(' ')).to.contain(`${Math.round(2900 * r)} rpm`);
  });

  it('re-checks a saved choice at the speed kept with it, as the operating point at that speed has it', async () => {
    const design: DesignDraft = {
      unitSystem: 'si',
      system: {
        staticMode: 'direct',
        staticHead: 4,
        intakeLevel: 0,
        dischargeLevel: 4,
        outletPressureHead: 0,
        waterTemperatureC: 20,
        frictionMethod: 'hazen-williams',
        segments: [{ series: 'pvc-sch40', size: 'pvc-sch40-2', length: 30, fittings: [], extraK: 0 }],
      },
      band: { flowMin: 100, flowMax: 200 },
      search: {
        arrangements: [1],
        requireOneFailed: false,
        standby: false,
        onlyPreferredRegion: false,
        maxInputPowerPerPump: null,
        hoursPerDay: 24,
        tariffPerKWh: null,
        limit: 20,
      },
    };
    const recheck = async (speedRpm: number | null) => {
      const choice = { pumpId: ids[0], arrangement: { installed: 1, running: 1 }, speedRpm };
      const project = (await postTo('/projects', { name: `Drive ${speedRpm}`, design, choice }).expect(201)).body;
      return (await postTo(`/projects/${project.id}/recheck`).expect(200)).body as ProjectRecheck;
    };
    const [nominal, slowed] = [await recheck(null), await recheck(2175)];
    const expected = await postTo('/calculations/operating-point', {
      units: { flow: 'L/min', head: 'm', length: 'm', diameter: 'mm', power: 'W' },
      system: designPipeSystem(design.system),
      pump: { pumpId: ids[0] },
      speed: { rpm: 2175 },
    }).expect(200);
    expect(slowed.saved.operatingPoint!.flow).to.be.closeTo(expected.body.operatingPoint.flow, 1e-6);
    expect(slowed.saved.operatingPoint!.flow).to.be.below(nominal.saved.operatingPoint!.flow);
    expect(slowed.saved.reasons.join(' ')).to.contain('at 2175 rpm, 75 % of nominal speed');
    expect(nominal.saved.reasons.join(' ')).to.not.contain('rpm');
  });

  it('cautions below 60 % speed when the band asks for so little', async () => {
    const body = (await post({ ...search, duty: { flowMin: 1.9, flowMax: 2.5 } }).expect(200))
      .body as SelectionResponse;
    const ranged = body.candidates.find((candidate) => candidate.pumpId === ids[0])!;
    const r = ratioForFlow(1.9);
    expect(r).to.be.within(0.5, 0.6);
    expect(ranged.speed!.ratio).to.be.closeTo(r, 1e-5);
    expect(ranged.warnings).to.include('low-speed');
  });

  it('keeps a drive within its range: a band needing less than its lowest speed gets the lowest', async () => {
    const body = (await post({ ...search, duty: { flowMin: 0.1, flowMax: 0.3 } }).expect(200))
      .body as SelectionResponse;
    const ranged = body.candidates.find((candidate) => candidate.pumpId === ids[0]);
    expect(ratioForFlow(0.1)).to.be.below(0.5);
    if (ranged) expect(ranged.speed).to.deep.equal({ ratio: 0.5, rpm: 1450 });
    const twoSpeed = body.candidates.find((candidate) => candidate.pumpId === ids[1]);
    if (twoSpeed) expect(twoSpeed.speed).to.deep.equal({ ratio: 0.5, rpm: 1450 });
    expect(ranged ?? twoSpeed, 'one of them among the candidates').to.not.equal(undefined);
  });
});
