import { expect } from 'chai';
import {
  HydraulicsInputError,
  headFromSI,
  npshAvailable,
  npshMargin,
  standardAtmosphericPressure,
  waterDensity,
  waterVapourPressure,
} from '../../shared/hydraulics';

describe('NPSH', () => {
  it('standard atmosphere (ISO 2533 / ICAO): 101.325 kPa at sea level, 89.88 kPa at 1000 m, 79.50 kPa at 2000 m (table values from memory)', () => {
    expect(standardAtmosphericPressure(0)).to.equal(101325);
    expect(standardAtmosphericPressure(1000)).to.be.closeTo(89876, 10);
    expect(standardAtmosphericPressure(2000)).to.be.closeTo(79501, 10);
  });

  it('the atmosphere at sea level holds about 33.9 ft of 20 C water (common practice figure)', () => {
    const head = 101325 / (waterDensity(20) * 9.80665);
    expect(headFromSI(head, 'ft')).to.be.closeTo(33.9, 0.1);
  });

  it('NPSHa = (p_atm - p_v)/(rho g) + z_s - h_f,s, a suction lift counting negative', () => {
    const lift = npshAvailable({ surfacePressure: 101325, temperature: 20, surfaceElevation: -3, suctionLosses: 0.5 });
    const expected = (101325 - waterVapourPressure(20)) / (waterDensity(20) * 9.80665) - 3 - 0.5;
    expect(lift).to.be.closeTo(expected, 1e-12);
    expect(lift).to.be.closeTo(6.61, 0.01);
    const flooded = npshAvailable({
      surfacePressure: standardAtmosphericPressure(1500),
      temperature: 30,
      surfaceElevation: 1,
      suctionLosses: 0.2,
    });
    expect(flooded).to.be.lessThan(
      npshAvailable({ surfacePressure: 101325, temperature: 30, surfaceElevation: 1, suctionLosses: 0.2 }),
    );
  });

  it('margin against NPSH required per ANSI/HI 9.6.1 clean-water guidance (ratio >= 1.1 and >= 0.6 m)', () => {
    expect(npshMargin(4.0, 3.5)).to.deep.include({ adequate: false }); // ratio 1.14 but only 0.5 m
    expect(npshMargin(4.2, 3.5)).to.deep.include({ adequate: true });
    expect(npshMargin(7.6, 7.0)).to.deep.include({ adequate: false }); // 0.6 m but ratio 1.086
    const margin = npshMargin(5, 4);
    expect(margin.ratio).to.equal(1.25);
    expect(margin.difference).to.equal(1);
  });

  it('rejects bad suction input', () => {
    expect(() => npshAvailable({ surfacePressure: 0, temperature: 20, surfaceElevation: 0, suctionLosses: 0 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/surfacePressure');
    expect(() => npshAvailable({ surfacePressure: 1e5, temperature: 20, surfaceElevation: 0, suctionLosses: -1 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/suctionLosses');
    expect(() => npshAvailable({ surfacePressure: 1e5, temperature: 45, surfaceElevation: 0, suctionLosses: 0 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/temperature');
    expect(() => npshMargin(3, 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/npshRequired');
  });
});
