import { expect } from 'chai';
import {
  HydraulicsInputError,
  waterDensity,
  waterDynamicViscosity,
  waterKinematicViscosity,
  waterProperties,
  waterVapourPressure,
} from '../../shared/hydraulics';

/*
 * Reference values: IAPWS-95 (density, vapour pressure) and IAPWS 2008
 * (viscosity) at 0.1 MPa, as computed with python3-iapws and listed in the
 * product's domain handbook.
 */
const IAPWS = [
  { temperature: 10, density: 999.7, viscosity: 1.3059e-3, vapourPressure: 1.228e3 },
  { temperature: 20, density: 998.21, viscosity: 1.0016e-3, vapourPressure: 2.339e3 },
  { temperature: 30, density: 995.65, viscosity: 0.7972e-3, vapourPressure: 4.247e3 },
];

describe('water properties', () => {
  for (const reference of IAPWS) {
    it(`at ${reference.temperature} C agree with IAPWS`, () => {
      // Kell 1975 vs IAPWS-95: within 0.02 kg/m3
      expect(waterDensity(reference.temperature)).to.be.closeTo(reference.density, 0.02);
      // Kestin et al. 1978 vs IAPWS 2008: within 0.2 %
      expect(waterDynamicViscosity(reference.temperature)).to.be.closeTo(
        reference.viscosity,
        0.002 * reference.viscosity,
      );
      // Wagner-Pruss 1993 vs the 4-figure IAPWS value: within 0.1 %
      expect(waterVapourPressure(reference.temperature)).to.be.closeTo(
        reference.vapourPressure,
        0.001 * reference.vapourPressure,
      );
      expect(waterKinematicViscosity(reference.temperature)).to.be.closeTo(
        reference.viscosity / reference.density,
        0.002 * (reference.viscosity / reference.density),
      );
    });
  }

  it('gathers the three properties for one temperature', () => {
    expect(waterProperties(25)).to.deep.equal({
      temperature: 25,
      density: waterDensity(25),
      kinematicViscosity: waterKinematicViscosity(25),
      vapourPressure: waterVapourPressure(25),
    });
  });

  it('density peaks near 4 C and viscosity falls with temperature across 0-40 C', () => {
    expect(waterDensity(4)).to.be.greaterThan(waterDensity(0));
    expect(waterDensity(4)).to.be.greaterThan(waterDensity(8));
    for (let t = 1; t <= 40; t += 1) {
      expect(waterDynamicViscosity(t)).to.be.lessThan(waterDynamicViscosity(t - 1));
      expect(waterVapourPressure(t)).to.be.greaterThan(waterVapourPressure(t - 1));
    }
  });

  it('rejects temperatures outside 0-40 C with a typed error', () => {
    expect(() => waterDensity(-1))
      .to.throw(HydraulicsInputError, /between 0 and 40/)
      .with.property('field', '/temperature');
    expect(() => waterVapourPressure(41)).to.throw(HydraulicsInputError);
    expect(() => waterKinematicViscosity(Number.NaN, '/water/temperature'))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/water/temperature');
  });
});
