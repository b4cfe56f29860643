import { expect } from 'chai';
import {
  HydraulicsInputError,
  darcyFrictionFactor,
  frictionFactorColebrook,
  frictionFactorSwameeJain,
  headLossDarcyWeisbach,
  headLossHazenWilliams,
} from '../../shared/hydraulics';
import { type FluidsAnswer, fluidsReference } from './reference/fluids-reference';

const REYNOLDS = [2300, 4000, 1e4, 1e5, 1e6, 1e7, 1e8];
const RELATIVE_ROUGHNESS = [0, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 5e-2];
const GRID: [number, number][] = REYNOLDS.flatMap((re) => RELATIVE_ROUGHNESS.map((ed): [number, number] => [re, ed]));
/** The transition band, where fluids' friction_factor (Clamond's solution of Colebrook) is the reference. */
const TRANSITION: [number, number][] = [2300, 2500, 2800, 3200, 3600, 3999].flatMap((re) =>
  [0, 1e-5, 1e-4, 1e-3, 1e-2].map((ed): [number, number] => [re, ed]),
);

describe('friction', () => {
  let reference: FluidsAnswer;
  before(() => {
    reference = fluidsReference({ colebrook: GRID, swameeJain: GRID, frictionFactor: TRANSITION });
  });

  it('solves Colebrook-White to 1e-12 of python3-fluids Colebrook (exact Lambert-W solution) over Re 2300-1e8, eps/D 0-0.05', () => {
    GRID.forEach(([re, ed], index) => {
      const expected = reference.colebrook[index];
      expect(frictionFactorColebrook(re, ed), `Re ${re}, eps/D ${ed}`).to.be.closeTo(expected, 1e-12 * expected);
    });
  });

  it('leaves a Colebrook residual at machine precision', () => {
    for (const [re, ed] of GRID) {
      const f = frictionFactorColebrook(re, ed);
      const rhs = -2 * Math.log10(ed / 3.7 + 2.51 / (re * Math.sqrt(f)));
      expect(1 / Math.sqrt(f)).to.be.closeTo(rhs, 1e-13 * rhs);
    }
  });

  it('matches python3-fluids Swamee_Jain_1976 for the explicit option', () => {
    // fluids writes the constant 5.74 as 6.97^0.9 = 5.7376, hence 1e-5 rather than machine precision
    GRID.forEach(([re, ed], index) => {
      const expected = reference.swameeJain[index];
      expect(frictionFactorSwameeJain(re, ed)).to.be.closeTo(expected, 1e-5 * expected);
    });
  });

  it('uses 64/Re below Re 2277, the turbulent correlation from 2300 (the transition band included) and a ramp between', () => {
    expect(darcyFrictionFactor(2000, 1e-4)).to.equal(64 / 2000);
    expect(darcyFrictionFactor(2276.9, 0)).to.equal(64 / 2276.9);
    expect(darcyFrictionFactor(2277, 0)).to.be.closeTo(64 / 2277, 1e-15);
    expect(darcyFrictionFactor(2299.999, 1e-3)).to.be.closeTo(frictionFactorColebrook(2300, 1e-3), 1e-6);
    expect(darcyFrictionFactor(2300, 1e-3)).to.equal(frictionFactorColebrook(2300, 1e-3));
    expect(darcyFrictionFactor(3150, 1e-3)).to.equal(frictionFactorColebrook(3150, 1e-3));
    expect(darcyFrictionFactor(3150, 1e-3, 'swamee-jain')).to.equal(frictionFactorSwameeJain(3150, 1e-3));
    expect(darcyFrictionFactor(1e5, 1e-4, 'swamee-jain')).to.equal(frictionFactorSwameeJain(1e5, 1e-4));
  });

  it('gives python3-fluids friction_factor in the transition band (Re 2300-4000) to 1e-12, where a straight-line blend would run 17-40 % low', () => {
    TRANSITION.forEach(([re, ed], index) => {
      const expected = reference.frictionFactor[index];
      expect(darcyFrictionFactor(re, ed), `Re ${re}, eps/D ${ed}`).to.be.closeTo(expected, 1e-12 * expected);
    });
    // the old blend at Re 3000, eps/D 1e-4: a line from 64/2300 to Colebrook at 4000
    const blend = 64 / 2300 + ((frictionFactorColebrook(4000, 1e-4) - 64 / 2300) * (3000 - 2300)) / 1700;
    expect(blend / darcyFrictionFactor(3000, 1e-4)).to.be.lessThan(0.83);
  });

  it('Darcy-Weisbach head loss equals f L/D V^2/2g and is zero at zero flow', () => {
    const diameter = 0.1;
    const flow = 0.01;
    const nu = 1.0e-6;
    const velocity = flow / ((Math.PI * diameter * diameter) / 4);
    const f = frictionFactorColebrook((velocity * diameter) / nu, 4.5e-5 / diameter);
    const expected = (f * 100 * velocity * velocity) / (diameter * 2 * 9.80665);
    expect(headLossDarcyWeisbach(100, flow, diameter, 4.5e-5, nu)).to.be.closeTo(expected, 1e-12 * expected);
    expect(headLossDarcyWeisbach(100, 0, diameter, 4.5e-5, nu)).to.equal(0);
  });

  // US form h_f = 10.44 L Q^1.85 / (C^1.85 d^4.8655) (ft, gpm, in), evaluated here for comparison only
  const usFormFeet = (feet: number, gpm: number, inches: number) =>
    (10.44 * feet * Math.pow(gpm, 1.85)) / (Math.pow(150, 1.85) * Math.pow(inches, 4.8655));
  const siFormFeet = (feet: number, gpm: number, inches: number) =>
    headLossHazenWilliams(feet * 0.3048, (gpm * 3.785411784e-3) / 60, inches * 0.0254, 150) / 0.3048;

  it('SI Hazen-Williams is 0.6 % below the US form at 100 gpm in 3 in pipe, within 1.8 % over 5-3000 gpm in 1/2-8 in', () => {
    expect(siFormFeet(240, 100, 3) / usFormFeet(240, 100, 3) - 1).to.be.closeTo(-0.006, 0.001);
    for (const gpm of [5, 50, 300, 3000]) {
      for (const inches of [0.5, 2, 8]) {
        expect(
          Math.abs(siFormFeet(1000, gpm, inches) / usFormFeet(1000, gpm, inches) - 1),
          `${gpm} gpm, ${inches} in`,
        ).to.be.lessThan(0.018);
      }
    }
  });

  it('rejects bad inputs with HydraulicsInputError naming the field, never NaN', () => {
    expect(() => headLossHazenWilliams(-1, 0.01, 0.1, 150))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/length');
    expect(() => headLossHazenWilliams(10, 0.01, 0, 150))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/insideDiameter');
    expect(() => headLossHazenWilliams(10, Number.NaN, 0.1, 150))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/flow');
    expect(() => headLossDarcyWeisbach(10, 0.01, 0.1, 1e-5, Number.POSITIVE_INFINITY)).to.throw(HydraulicsInputError);
    expect(() => frictionFactorSwameeJain(0, 1e-4))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/reynolds');
  });
});
