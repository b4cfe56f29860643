import { expect } from 'chai';
import {
  compileSuctionSide,
  compileSystemCurve,
  DEFAULT_NPSH_GUIDANCE,
  fitPumpCurve,
  gravityFlow,
  HydraulicsInputError,
  npshAtDuty,
  npshAvailableAt,
  type PipeSegmentInput,
  type SystemCurveInput,
} from '../../shared/hydraulics';
import { npshReference } from './reference/npsh-reference';

/*
 * The suction side, NPSH available over flow and gravity flow. References: the atmosphere of
 * python3-fluids (ATMOSPHERE_1976) and the vapour pressure and density of python3-iapws
 * (IAPWS-IF97) at test time; losses and gravity flow by hand from the SI Hazen-Williams form
 * h_f = 10.67 L Q^1.852 / (C^1.852 D^4.8704) and K V^2 / 2g (the formulas friction.ts cites).
 */

const g = 9.80665;
const bore = 0.08;
const area = (Math.PI * bore * bore) / 4;
/** Suction loss head of `length` m of 80 mm pipe, C 140, with `k`, by hand. */
function lossByHand(length: number, k: number, flow: number): number {
  const friction = (10.67 * length * Math.pow(flow, 1.852)) / (Math.pow(140, 1.852) * Math.pow(bore, 4.8704));
  return friction + (k * (flow / area) ** 2) / (2 * g);
}

function segment(length: number, side: 'suction' | 'discharge', extraK = 0): PipeSegmentInput {
  return { length, insideDiameter: bore, hazenWilliamsC: 140, extraK, side };
}

function system(overrides: Partial<SystemCurveInput>): SystemCurveInput {
  return {
    staticHead: 4,
    frictionMethod: 'hazen-williams',
    segments: [segment(5, 'suction', 2.5), segment(40, 'discharge', 1)],
    temperature: 30,
    siteElevation: 1500,
    pumpElevation: 3,
    ...overrides,
  };
}

describe('suction side and NPSH available', () => {
  it('NPSHa = p_atm/(rho g) - pumpElevation - h_loss,suction(Q) - p_v/(rho g), with python3-fluids and python3-iapws values', () => {
    const reference = npshReference([0, 1500], [10, 30]);
    for (const [siteIndex, siteElevation] of [0, 1500].entries()) {
      for (const [waterIndex, temperature] of [10, 30].entries()) {
        const side = compileSuctionSide(system({ siteElevation, temperature }))!;
        const { vapourPressure, density } = reference.water[waterIndex];
        for (const flow of [0, 0.004, 0.012]) {
          const byHand =
            (reference.atmosphere[siteIndex] - vapourPressure) / (density * g) - 3 - lossByHand(5, 2.5, flow);
          // the engine's ISO 2533 constants and water correlations agree with the libraries to ~1 mm of head
          expect(npshAvailableAt(side, flow), `${siteElevation} m, ${temperature} C, ${flow} m3/s`).to.be.closeTo(
            byHand,
            2e-3,
          );
        }
      }
    }
  });

  it('by hand at sea level, 20 C, flooded 1.5 m, no flow: (101325 - 2339.2)/(998.21 g) + 1.5 = 11.6119 m', () => {
    const side = compileSuctionSide(system({ siteElevation: 0, temperature: 20, pumpElevation: -1.5 }))!;
    expect(npshAvailableAt(side, 0)).to.be.closeTo((101325 - 2339.2) / (998.206 * g) + 1.5, 1e-3);
    expect(npshAvailableAt(side, 0)).to.be.closeTo(11.6119, 1e-3);
  });

  it('falls with flow by the suction losses alone: the discharge segments do not count', () => {
    const short = compileSuctionSide(system({}))!;
    const longerDischarge = compileSuctionSide(
      system({ segments: [segment(5, 'suction', 2.5), segment(400, 'discharge')] }),
    )!;
    expect(npshAvailableAt(short, 0.01)).to.equal(npshAvailableAt(longerDischarge, 0.01));
    expect(npshAvailableAt(short, 0) - npshAvailableAt(short, 0.01)).to.be.closeTo(lossByHand(5, 2.5, 0.01), 1e-9);
  });

  it('has no suction side without suction segments, and refuses a pump elevation then', () => {
    const plain = system({ segments: [segment(40, 'discharge')], siteElevation: undefined, pumpElevation: undefined });
    expect(compileSuctionSide(plain)).to.equal(null);
    expect(
      compileSuctionSide({ ...plain, segments: [{ length: 40, insideDiameter: bore, hazenWilliamsC: 140 }] }),
    ).to.equal(null);
    expect(() => compileSuctionSide({ ...plain, pumpElevation: 2 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/pumpElevation');
  });

  it('refuses a suction segment after a discharge one, naming it, and a suction side without site or pump elevation', () => {
    const misplaced = system({ segments: [segment(5, 'suction'), segment(10, 'discharge'), segment(3, 'suction')] });
    expect(() => compileSuctionSide(misplaced))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/segments/2/side');
    expect(() => compileSuctionSide(system({ siteElevation: undefined })))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/siteElevation');
    expect(() => compileSuctionSide(system({ pumpElevation: undefined })))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/pumpElevation');
    expect(() => compileSuctionSide(system({ siteElevation: 12000 })))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/siteElevation');
  });

  it('compares with NPSH3 at the flow per pump, margin by ANSI/HI 9.6.1 guidance; unknown outside the NPSH3 data', () => {
    const side = compileSuctionSide(system({ siteElevation: 0, temperature: 20, pumpElevation: 3 }))!;
    // invented points on NPSH3 = 1 + 40000 Q^2 (m, m3/s)
    const fit = fitPumpCurve(
      [0, 0.005, 0.01, 0.015].map((flow) => ({
        flow,
        head: 20 - 40000 * flow * flow,
        npshRequired: 1 + 40000 * flow * flow,
      })),
    );
    const duty = npshAtDuty(side, fit, 0.012, 0.006, DEFAULT_NPSH_GUIDANCE);
    expect(duty.required).to.be.closeTo(1 + 40000 * 0.006 ** 2, 1e-9);
    expect(duty.available).to.be.closeTo(npshAvailableAt(side, 0.012), 1e-12);
    expect(duty.margin!.ratio).to.be.closeTo(duty.available / duty.required!, 1e-12);
    // about 6.04 m available over 2.44 m required (by hand): ratio 2.47, enough for 1.1 but not for 3
    expect(duty.margin!.adequate).to.equal(true);
    expect(npshAtDuty(side, fit, 0.012, 0.006, { ratio: 3, difference: 0.6 }).margin!.adequate).to.equal(false);
    // at 20 L/s through the one suction pipe, 2 x 10 L/s: about 4.21 m available against 5 m
    expect(npshAtDuty(side, fit, 0.02, 0.01, DEFAULT_NPSH_GUIDANCE).margin!.adequate).to.equal(false);
    const partly = fitPumpCurve(
      [0, 0.005, 0.01, 0.015].map((flow, index) => ({
        flow,
        head: 20 - 40000 * flow * flow,
        ...(index < 3 ? { npshRequired: 1 + 40000 * flow * flow } : {}),
      })),
    );
    expect(npshAtDuty(side, partly, 0.0125, 0.0125, DEFAULT_NPSH_GUIDANCE)).to.deep.include({
      required: null,
      margin: null,
    });
    const withoutData = fitPumpCurve([0, 0.005, 0.01].map((flow) => ({ flow, head: 20 - 40000 * flow * flow })));
    expect(npshAtDuty(side, withoutData, 0.01, 0.01, DEFAULT_NPSH_GUIDANCE)).to.deep.include({
      required: null,
      margin: null,
    });
  });
});

describe('gravity flow', () => {
  it('solves system head = 0 when the outlet is below the intake (by hand: bisection on the formulas)', () => {
    const input: SystemCurveInput = {
      staticHead: -2.5,
      frictionMethod: 'hazen-williams',
      segments: [{ length: 60, insideDiameter: bore, hazenWilliamsC: 140, extraK: 1.5 }],
    };
    let low = 0;
    let high = 1;
    for (let step = 0; step < 200; step += 1) {
      const middle = (low + high) / 2;
      if (-2.5 + lossByHand(60, 1.5, middle) < 0) low = middle;
      else high = middle;
    }
    expect(gravityFlow(compileSystemCurve(input))).to.be.closeTo(low, 1e-9);
  });

  it('counts the outlet pressure and gives none when the system needs head at zero flow', () => {
    const segments = [{ length: 60, insideDiameter: bore, hazenWilliamsC: 140 }];
    expect(gravityFlow(compileSystemCurve({ staticHead: 2, frictionMethod: 'hazen-williams', segments }))).to.equal(
      null,
    );
    expect(
      gravityFlow(
        compileSystemCurve({ staticHead: -2, outletPressureHead: 2, frictionMethod: 'hazen-williams', segments }),
      ),
    ).to.equal(null);
    const darcy = compileSystemCurve({
      staticHead: -1,
      frictionMethod: 'darcy-weisbach',
      segments: [{ ...segments[0], roughness: 1.5e-6 }],
    });
    const flow = gravityFlow(darcy)!;
    expect(Math.abs(darcy.evaluate(flow))).to.be.below(1e-9);
  });
});
