import { expect } from 'chai';
import {
  HydraulicsInputError,
  waterDensity,
  waterDynamicViscosity,
  waterKinematicViscosity,
  waterProperties,
  waterVapourPressure,
} from '../../shared/hydraulics';
import { iapwsReference } from './reference/iapws-reference';
import { refusalOf } from '../support/engine-refusal';

/*
 * Reference values: IAPWS-95 (density, vapour pressure) and IAPWS 2008
 * (viscosity) at 0.1 MPa, as computed with python3-iapws and listed in the
 * product's domain handbook; the suite below also asks python3-iapws itself.
 */
const IAPWS = [
  { temperature: 10, density: 999.7, viscosity: 1.3059e-3, vapourPressure: 1.228e3 },
  { temperature: 20, density: 998.21, viscosity: 1.0016e-3, vapourPressure: 2.339e3 },
  { temperature: 30, density: 995.65, viscosity: 0.7972e-3, vapourPressure: 4.247e3 },
];

describe('water properties', () => {
  for (const reference of IAPWS) {
    it(`at ${reference.temperature} C agree with IAPWS`, () => {
      // IAPWS-IF97 region 1 vs IAPWS-95: within 0.02 kg/m3
      expect(waterDensity(reference.temperature)).to.be.closeTo(reference.density, 0.02);
      // IAPWS 2008 on the IF97 density vs IAPWS 2008 on IAPWS-95: within 0.2 %
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

  describe('against python3-iapws (IAPWS-95 with the IAPWS 2008 viscosity), 0-40 C', () => {
    const temperatures = [0.5, 5, 10, 15, 20, 25, 30, 35, 40];
    const reference = iapwsReference(temperatures);
    temperatures.forEach((temperature, index) => {
      const expected = reference.water[index];
      it(`at ${temperature} C: density within 1e-5, viscosity within 1e-5, vapour pressure within 1e-4`, () => {
        // IF97 reproduces IAPWS-95 to about 1e-5 in density here (IAPWS R7-97(2012), section 5)
        expect(waterDensity(temperature)).to.be.closeTo(expected.density, 1e-5 * expected.density);
        expect(waterDynamicViscosity(temperature)).to.be.closeTo(expected.viscosity, 1e-5 * expected.viscosity);
        expect(waterVapourPressure(temperature)).to.be.closeTo(expected.vapourPressure, 1e-4 * expected.vapourPressure);
      });
    });
  });

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
    expect(refusalOf(() => waterDensity(-1))).to.deep.include({ code: 'out-of-range', pointer: '/temperature' });
    expect(refusalOf(() => waterDensity(-1)).params).to.deep.include({ min: 0, max: 40, value: -1 });
    expect(() => waterVapourPressure(41)).to.throw(HydraulicsInputError);
    expect(() => waterKinematicViscosity(Number.NaN, '/water/temperature'))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/water/temperature');
  });
});
