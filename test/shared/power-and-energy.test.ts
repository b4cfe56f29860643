import { expect } from 'chai';
import {
  HydraulicsInputError,
  STANDARD_GRAVITY,
  annualEnergy,
  energyCost,
  fitPumpCurve,
  flowToSI,
  headToSI,
  hydraulicPower,
  powerAtOperatingPoint,
  specificEnergy,
  waterDensity,
} from '../../shared/hydraulics';

const HORSEPOWER = 745.6999; // W per mechanical hp (550 ft lbf/s), NIST SP 811

describe('power and energy', () => {
  it('water power matches the Hydraulic Institute formula whp = Q(gpm) H(ft) SG / 3960', () => {
    for (const [gpm, feet] of [
      [100, 39.6],
      [250, 60],
      [1000, 120],
    ]) {
      const watts = hydraulicPower(flowToSI(gpm, 'gpm'), headToSI(feet, 'ft'), waterDensity(20));
      // 3960 takes water at about 8.33 lb/gal; 998.2 kg/m3 at 20 C is within 0.2 % of that
      expect(watts / HORSEPOWER).to.be.closeTo((gpm * feet) / 3960, 0.002 * ((gpm * feet) / 3960));
    }
  });

  it('annual energy and cost: 500 W for 24 h a day is 4380 kWh a year, at 0.15 per kWh 657', () => {
    expect(annualEnergy(500, 24)).to.be.closeTo(4380, 1e-9);
    expect(annualEnergy(500, 8)).to.be.closeTo(1460, 1e-9);
    expect(energyCost(4380, 0.15)).to.be.closeTo(657, 1e-9);
  });

  it('specific energy: 1 kW moving 1 m3/h is 1 kWh/m3 and 3.785 kWh per 1000 US gal', () => {
    const result = specificEnergy(1000, flowToSI(1, 'm3/h'));
    expect(result.perCubicMetre).to.be.closeTo(1, 1e-12);
    expect(result.perThousandUsGallons).to.be.closeTo(3.785411784, 1e-9);
  });

  const flows = [0, 0.002, 0.004, 0.006, 0.008];
  const head = (q: number) => 15 - 1e5 * q * q;
  const efficiency = (q: number) => 0.8 * (2 * (q / 0.005) - (q / 0.005) ** 2);

  it('input power from efficiency, motor and drive: P = rho g Q H / (eta_pump eta_motor eta_drive)', () => {
    const fit = fitPumpCurve(flows.map((flow) => ({ flow, head: head(flow), efficiency: efficiency(flow) })));
    const rho = waterDensity(20);
    const q = 0.005;
    const result = powerAtOperatingPoint(fit, q, head(q), rho, { motor: 0.85, drive: 0.95 });
    const hydraulic = rho * STANDARD_GRAVITY * q * head(q);
    expect(result.hydraulic).to.be.closeTo(hydraulic, 1e-9);
    expect(result.electrical).to.be.closeTo(hydraulic / (0.8 * 0.85 * 0.95), 1e-6);
    expect(result.wireToWaterEfficiency).to.be.closeTo(0.8 * 0.85 * 0.95, 1e-9);
  });

  it('input power from the power curve: shaft power divided by motor efficiency, electrical power as given', () => {
    const points = flows.map((flow) => ({ flow, head: head(flow), power: 400 + 6e4 * flow }));
    const shaft = fitPumpCurve(points, { powerBasis: 'shaft' });
    const electrical = fitPumpCurve(points, { powerBasis: 'electrical' });
    const q = 0.004;
    expect(powerAtOperatingPoint(shaft, q, head(q), 998, { motor: 0.8 }).electrical).to.be.closeTo(
      (400 + 6e4 * q) / 0.8,
      1e-6,
    );
    expect(powerAtOperatingPoint(electrical, q, head(q), 998, { motor: 0.8 }).electrical).to.be.closeTo(
      400 + 6e4 * q,
      1e-6,
    );
  });

  it('reports unknown input power as null without power or efficiency data, and rejects bad input', () => {
    const fit = fitPumpCurve(flows.map((flow) => ({ flow, head: head(flow) })));
    expect(powerAtOperatingPoint(fit, 0.004, head(0.004), 998)).to.include({
      electrical: null,
      wireToWaterEfficiency: null,
    });
    expect(() => powerAtOperatingPoint(fit, 0.009, 5, 998))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/flow');
    expect(() => powerAtOperatingPoint(fit, 0.004, 5, 998, { motor: 1.2 }))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/motorEfficiency');
    expect(() => annualEnergy(100, 25))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/hoursPerDay');
    expect(() => specificEnergy(100, 0))
      .to.throw(HydraulicsInputError)
      .with.property('field', '/flow');
    expect(() => energyCost(Number.NaN, 0.1)).to.throw(HydraulicsInputError);
  });
});
