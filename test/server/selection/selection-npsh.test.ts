import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import type { SelectionCandidate } from '../../../shared/api/api-schemas';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { npshReference } from '../../shared/reference/npsh-reference';
import { seedSyntheticCatalog, type SyntheticPumpShape } from './synthetic-catalog';

/*
 * NPSH in the ranking, over invented pumps with one head curve (so one operating point) and
 * different efficiencies and NPSH3: a pump short of the margin (ANSI/HI 9.6.1 guidance, ratio
 * 1.1 and 0.6 m, unless the request asks for another ratio) ranks below every pump with enough,
 * whatever its energy; one without NPSH data says so; a submersible has no suction side to check.
 * NPSHa by hand from python3-fluids (ATMOSPHERE_1976) and python3-iapws (IAPWS-IF97) at test time.
 * Gravity flow by hand from the SI Hazen-Williams form.
 */

const g = 9.80665;
const units = { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm' } as const;
const shape = { shutOffHead: 14, lastFlow: 0.01 };
/** Most efficient but short of NPSH; least efficient with plenty; between, without NPSH data. */
const externalShapes: SyntheticPumpShape[] = [
  { ...shape, peakEfficiency: 0.65, npshAtEnd: 14 },
  { ...shape, peakEfficiency: 0.5, npshAtEnd: 3 },
  { ...shape, peakEfficiency: 0.55 },
];
const segments = [
  { length: 3, insideDiameter: 80, hazenWilliamsC: 140, side: 'suction' },
  { length: 30, insideDiameter: 80, hazenWilliamsC: 140 },
];
const suctionSystem = { staticHead: 7, frictionMethod: 'hazen-williams', siteElevation: 0, pumpElevation: 2, segments };
const friction = (length: number, litres: number) =>
  (10.67 * length * Math.pow(litres / 1000, 1.852)) / (Math.pow(140, 1.852) * Math.pow(0.08, 4.8704));

describe('NPSH and gravity in POST /api/v1/selections', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let token: string;
  let external: number[];
  let submersible: number[];
  let supplierIds: number[];

  before(async () => {
    scratch = await createScratchDatabase('selection_npsh');
    external = await seedSyntheticCatalog(
      scratch.sequelize,
      externalShapes,
      'External Test Pumps',
      'external-centrifugal',
    );
    submersible = await seedSyntheticCatalog(scratch.sequelize, [{ ...shape, peakEfficiency: 0.6, npshAtEnd: 14 }]);
    const rows = await scratch.sequelize.query<{ supplier_id: number }>(
      'SELECT DISTINCT supplier_id FROM pumps WHERE id IN (?)',
      { replacements: [[...external, ...submersible]], type: QueryTypes.SELECT },
    );
    supplierIds = rows.map((row) => row.supplier_id);
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const search = (system: object, extra: object = {}) =>
    request(app)
      .post('/api/v1/selections')
      .set('Authorization', `Bearer ${token}`)
      .send({ units, system, duty: { flowMin: 3, flowMax: 9 }, arrangements: [1], filters: { supplierIds }, ...extra });

  const byPump = (candidates: SelectionCandidate[], pumpId: number) =>
    candidates.find((candidate) => candidate.pumpId === pumpId)!;

  it('without a suction side ranks by energy alone and checks no NPSH', async () => {
    const response = await search({
      ...suctionSystem,
      siteElevation: undefined,
      pumpElevation: undefined,
      segments: [segments[1]],
    }).expect(200);
    const candidates = response.body.candidates as SelectionCandidate[];
    expect(candidates[0].pumpId).to.equal(external[0]);
    for (const candidate of candidates) expect(candidate).not.to.have.property('npsh');
  });

  it('ranks a pump short of NPSH margin below every pump with enough, and says why', async () => {
    const response = await search(suctionSystem).expect(200);
    const validate = contractSchemaValidator('SelectionResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    const candidates = response.body.candidates as SelectionCandidate[];
    expect(candidates.map((candidate) => candidate.pumpId)).to.have.members([...external, ...submersible]);
    expect(candidates[candidates.length - 1].pumpId).to.equal(external[0]);
    const short = byPump(candidates, external[0]);
    const enough = byPump(candidates, external[1]);
    const unknown = byPump(candidates, external[2]);
    expect(short.npsh!.adequate).to.equal(false);
    expect(short.reasons.join(' ')).to.contain('NPSH shortfall');
    expect(short.misses).to.include('npsh-margin');
    expect(enough.misses).not.to.include('npsh-margin');
    expect(enough.npsh!.adequate).to.equal(true);
    expect(enough.reasons.join(' ')).to.contain('NPSH margin met');
    expect(unknown.npsh).to.include({ required: null, adequate: null });
    expect(unknown.reasons.join(' ')).to.contain('NPSH required unknown');
    expect(unknown.misses).not.to.include('npsh-margin');
    expect(byPump(candidates, submersible[0])).not.to.have.property('npsh');
    expect(response.body.warnings.join(' ')).to.contain('self-priming');

    const reference = npshReference([0], [20]);
    const { vapourPressure, density } = reference.water[0];
    const flow = enough.operatingPoint.flow;
    const byHand = (reference.atmosphere[0] - vapourPressure) / (density * g) - 2 - friction(3, flow);
    expect(enough.npsh!.available).to.be.closeTo(byHand, 2e-3);
    const x = flow / 10;
    expect(enough.npsh!.required!).to.be.closeTo(3 * (0.3 + 0.7 * x * x), 1e-6);
  });

  it('takes the margin ratio asked for: a stricter one turns the pump with enough into a shortfall', async () => {
    const first = await search(suctionSystem).expect(200);
    const ratio = byPump(first.body.candidates, external[1]).npsh!.ratio!;
    const response = await search(suctionSystem, {
      npshMarginRatio: Math.min(5, Math.ceil(ratio * 10) / 10 + 0.1),
    }).expect(200);
    const candidates = response.body.candidates as SelectionCandidate[];
    const enough = byPump(candidates, external[1]);
    expect(enough.npsh!.adequate).to.equal(false);
    expect(candidates.indexOf(enough)).to.be.greaterThan(candidates.indexOf(byPump(candidates, external[2])));
  });

  it('says what gravity alone delivers when the outlet is below the intake', async () => {
    const fall = {
      staticHead: -3,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 400, insideDiameter: 80, hazenWilliamsC: 140 }],
    };
    let [low, high] = [0, 100];
    for (let step = 0; step < 200; step += 1) {
      const middle = (low + high) / 2;
      if (friction(400, middle) < 3) low = middle;
      else high = middle;
    }
    const response = await search(fall).expect(200);
    expect(response.body.gravityFlow).to.be.closeTo(low, 1e-6);
    expect(response.body.warnings.join(' ')).to.contain('gravity alone delivers');
    const whole = await search(fall, { duty: { flowMin: 0.5, flowMax: 1 } }).expect(200);
    expect(whole.body.warnings.join(' ')).to.contain('no pump is needed');
  });

  it('answers 400 naming the field for an NPSH margin ratio out of range', async () => {
    const response = await search(suctionSystem, { npshMarginRatio: 9 }).expect(400);
    expect(response.body.pointer ?? response.body.errors?.[0]?.pointer).to.equal('/body/npshMarginRatio');
  });
});
