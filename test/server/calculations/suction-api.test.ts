import { expect } from 'chai';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { createLogger } from '../../../server/logging';
import { createUserWithSession } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { createScratchDatabase } from '../../support/test-database';
import { npshReference } from '../../shared/reference/npsh-reference';

/*
 * The suction side, NPSH and gravity flow through the HTTP stack. References: the atmosphere of
 * python3-fluids (ATMOSPHERE_1976) and the vapour pressure and density of python3-iapws
 * (IAPWS-IF97) at test time; suction losses and gravity flow by hand from the SI Hazen-Williams
 * form h_f = 10.67 L Q^1.852 / (C^1.852 D^4.8704); margins by the ANSI/HI 9.6.1 clean-water
 * guidance (ratio 1.1 and 0.6 m) unless the request asks for another ratio.
 */

const g = 9.80665;
const siUnits = { flow: 'L/s', head: 'm', length: 'm', diameter: 'mm' } as const;
const bore = 80;
/** Hazen-Williams friction head of `length` m of 80 mm pipe, C 140, at `litres` L/s, by hand. */
function frictionByHand(length: number, litres: number): number {
  return (10.67 * length * Math.pow(litres / 1000, 1.852)) / (Math.pow(140, 1.852) * Math.pow(bore / 1000, 4.8704));
}
const suctionSystem = {
  staticHead: 4,
  frictionMethod: 'hazen-williams',
  waterTemperatureC: 25,
  siteElevation: 1200,
  pumpElevation: 2.5,
  segments: [
    { length: 6, insideDiameter: bore, hazenWilliamsC: 140, side: 'suction' },
    { length: 40, insideDiameter: bore, hazenWilliamsC: 140 },
  ],
};
/** Invented pump: H = 16 - 0.1 Q^2 (m, L/s), NPSH3 = scale x (1.5 + 0.05 Q^2). */
function pumpCurve(withNpsh: boolean, npshScale = 1) {
  return [0, 3, 6, 9, 12].map((flow) => ({
    flow,
    head: 16 - 0.1 * flow * flow,
    ...(withNpsh ? { npshRequired: npshScale * (1.5 + 0.05 * flow * flow) } : {}),
  }));
}

describe('suction side, NPSH and gravity flow through the API', function () {
  this.timeout(60_000);
  let app: ReturnType<typeof createApp>;
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let token: string;

  before(async () => {
    scratch = await createScratchDatabase('suction');
    app = createApp({ sequelize: scratch.sequelize, logger: createLogger('silent') });
    token = (await createUserWithSession(scratch.sequelize, 'designer')).token;
  });

  after(async () => {
    await scratch?.drop();
  });

  const post = (path: string, body: unknown) =>
    request(app)
      .post(`/api/v1${path}`)
      .set('Authorization', `Bearer ${token}`)
      .send(body as object);

  /** NPSHa by hand at `litres` L/s through the suction pipe, from the python references. */
  function npshByHand(litres: number, siteElevation = 1200, pumpElevation = 2.5): number {
    const reference = npshReference([siteElevation], [25]);
    const { vapourPressure, density } = reference.water[0];
    return (reference.atmosphere[0] - vapourPressure) / (density * g) - pumpElevation - frictionByHand(6, litres);
  }

  it('gives NPSH available at every flow of the system curve, falling by the suction losses', async () => {
    const response = await post('/calculations/system-curve', {
      units: siUnits,
      system: suctionSystem,
      flows: [0, 4, 8],
    }).expect(200);
    const validate = contractSchemaValidator('SystemCurveResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    for (const point of response.body.points as Array<{ flow: number; npshAvailable: number }>) {
      expect(point.npshAvailable, `${point.flow} L/s`).to.be.closeTo(npshByHand(point.flow), 2e-3);
    }
    expect(response.body.warnings.join(' ')).to.contain('self-priming');
    expect(response.body).not.to.have.property('gravityFlow');
  });

  it('takes the site and pump elevations in the length unit, and a flooded suction gets no priming caution', async () => {
    const response = await post('/calculations/system-curve', {
      units: { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' },
      system: {
        ...suctionSystem,
        siteElevation: 1200 / 0.3048,
        pumpElevation: -1 / 0.3048,
        segments: suctionSystem.segments.map((segment) => ({ ...segment, insideDiameter: bore / 25.4 })),
      },
      flows: [0],
    }).expect(200);
    expect(response.body.points[0].npshAvailable * 0.3048).to.be.closeTo(npshByHand(0, 1200, -1), 2e-3);
    expect(response.body.warnings.join(' ')).not.to.contain('priming');
  });

  it('checks NPSH at the operating point against NPSH3 with the ANSI/HI 9.6.1 margin, or the ratio asked for', async () => {
    const response = await post('/calculations/operating-point', {
      units: siUnits,
      system: suctionSystem,
      pump: { curve: pumpCurve(true, 0.5) },
    }).expect(200);
    const validate = contractSchemaValidator('OperatingPointResponse');
    expect(validate(response.body), JSON.stringify(validate.errors)).to.equal(true);
    const { operatingPoint, npsh } = response.body;
    expect(npsh.available).to.be.closeTo(npshByHand(operatingPoint.flow), 2e-3);
    expect(npsh.required).to.be.closeTo(0.5 * (1.5 + 0.05 * operatingPoint.flow ** 2), 1e-6);
    expect(npsh.ratio).to.be.closeTo(npsh.available / npsh.required, 1e-9);
    expect(npsh).to.include({ adequate: true, marginRatio: 1.1, marginDifference: 0.6 });
    expect(response.body.warnings.join(' ')).to.contain("defer to the maker's data");

    const strict = await post('/calculations/operating-point', {
      units: siUnits,
      system: suctionSystem,
      pump: { curve: pumpCurve(true, 0.5) },
      npshMarginRatio: Math.ceil(npsh.ratio * 10) / 10 + 0.1,
    }).expect(200);
    expect(strict.body.npsh.adequate).to.equal(false);
    expect(strict.body.warnings.join(' ')).to.contain('NPSH shortfall');
  });

  it('says NPSH required unknown for a curve without NPSH data, and checks nothing without a suction side', async () => {
    const unknown = await post('/calculations/operating-point', {
      units: siUnits,
      system: suctionSystem,
      pump: { curve: pumpCurve(false) },
    }).expect(200);
    expect(unknown.body.npsh).to.include({ required: null, ratio: null, adequate: null });
    expect(unknown.body.warnings.join(' ')).to.contain('NPSH required unknown');
    const submersible = await post('/calculations/operating-point', {
      units: siUnits,
      system: {
        ...suctionSystem,
        siteElevation: undefined,
        pumpElevation: undefined,
        segments: [suctionSystem.segments[1]],
      },
      pump: { curve: pumpCurve(true) },
    }).expect(200);
    expect(submersible.body).not.to.have.property('npsh');
    expect(submersible.body.warnings.join(' ')).not.to.contain('priming');
  });

  describe('gravity flow', () => {
    const fallSystem = {
      staticHead: -3,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 50, insideDiameter: bore, hazenWilliamsC: 140 }],
    };
    /** The flow where -3 + h_f = 0, by bisection on the hand formula, L/s. */
    function gravityByHand(): number {
      let [low, high] = [0, 100];
      for (let step = 0; step < 200; step += 1) {
        const middle = (low + high) / 2;
        if (frictionByHand(50, middle) < 3) low = middle;
        else high = middle;
      }
      return low;
    }

    it('states what gravity alone delivers with the outlet below the intake', async () => {
      const curve = await post('/calculations/system-curve', { units: siUnits, system: fallSystem, flows: [0] }).expect(
        200,
      );
      expect(curve.body.gravityFlow).to.be.closeTo(gravityByHand(), 1e-6);
      expect(curve.body.warnings.join(' ')).to.contain('gravity alone delivers');
    });

    it('says so with an operating point, and in the 422 when the pump meets the system nowhere', async () => {
      const point = await post('/calculations/operating-point', {
        units: siUnits,
        system: { ...fallSystem, segments: [{ ...fallSystem.segments[0], length: 400 }] },
        pump: { curve: pumpCurve(false) },
      }).expect(200);
      expect(point.body.gravityFlow).to.be.greaterThan(0);
      expect(point.body.operatingPoint.flow).to.be.greaterThan(point.body.gravityFlow);
      const none = await post('/calculations/operating-point', {
        units: siUnits,
        system: fallSystem,
        pump: { curve: pumpCurve(false) },
      }).expect(422);
      expect(none.body.reason).to.equal('beyond-curve');
      expect(none.body.gravityFlow).to.be.closeTo(gravityByHand(), 1e-6);
      expect(none.body.detail).to.contain('gravity alone delivers');
    });
  });

  describe('bad suction input', () => {
    const cases: Array<{ name: string; system: unknown; extra?: object; status: number; pointer: string }> = [
      {
        name: 'a suction segment after a discharge one',
        system: { ...suctionSystem, segments: [...suctionSystem.segments, { ...suctionSystem.segments[0] }] },
        status: 422,
        pointer: '/body/system/segments/2/side',
      },
      {
        name: 'a suction side without the site elevation',
        system: { ...suctionSystem, siteElevation: undefined },
        status: 422,
        pointer: '/body/system/siteElevation',
      },
      {
        name: 'a suction side without the pump elevation',
        system: { ...suctionSystem, pumpElevation: undefined },
        status: 422,
        pointer: '/body/system/pumpElevation',
      },
      {
        name: 'a pump elevation without a suction side',
        system: { ...suctionSystem, segments: [suctionSystem.segments[1]], siteElevation: undefined },
        status: 422,
        pointer: '/body/system/pumpElevation',
      },
      {
        name: 'a site above the standard atmosphere tabulated',
        system: { ...suctionSystem, siteElevation: 20000 },
        status: 422,
        pointer: '/body/system/siteElevation',
      },
      {
        name: 'an unknown side',
        system: { ...suctionSystem, segments: [{ ...suctionSystem.segments[0], side: 'inlet' }] },
        status: 400,
        pointer: '/body/system/segments/0/side',
      },
      {
        name: 'an NPSH margin ratio below 1',
        system: suctionSystem,
        extra: { npshMarginRatio: 0.9 },
        status: 400,
        pointer: '/body/npshMarginRatio',
      },
    ];
    for (const { name, system, extra, status, pointer } of cases) {
      it(`answers ${status} naming ${pointer} for ${name}`, async () => {
        const response = await post('/calculations/operating-point', {
          units: siUnits,
          system,
          pump: { curve: pumpCurve(true) },
          ...extra,
        });
        expect(response.status, JSON.stringify(response.body)).to.equal(status);
        expect(response.type).to.equal('application/problem+json');
        expect(response.body.pointer ?? response.body.errors?.[0]?.pointer).to.equal(pointer);
      });
    }
  });
});
