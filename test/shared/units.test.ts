import { expect } from 'chai';
import fc from 'fast-check';
import { unit } from 'mathjs';
import {
  convertFlow,
  convertHead,
  convertLength,
  DIAMETER_UNITS,
  FLOW_UNITS,
  HEAD_UNITS,
  HydraulicsInputError,
  LENGTH_UNITS,
  PRESSURE_UNITS,
  diameterFromSI,
  diameterToSI,
  flowFromSI,
  flowToSI,
  headFromSI,
  headToPressure,
  headToSI,
  lengthFromSI,
  lengthToSI,
  pressureFromSI,
  pressureToHead,
  pressureToSI,
  velocityFromSI,
  velocityToSI,
  volumeFromSI,
  volumeToSI,
  convertDiameter,
  UNIT_FACTORS_TO_SI,
  waterDensity,
  type FlowUnit,
} from '../../shared/hydraulics';
import { refusalOf } from '../support/engine-refusal';

/** Each accepted unit as mathjs names it, with the SI unit of its quantity. */
const mathjsNames: Record<keyof typeof UNIT_FACTORS_TO_SI, { si: string; units: Record<string, string> }> = {
  flow: {
    si: 'm^3/s',
    units: {
      gpm: 'gallon/minute',
      gph: 'gallon/hour',
      'L/h': 'liter/hour',
      'L/min': 'liter/minute',
      'L/s': 'liter/second',
      'm3/h': 'm^3/hour',
      'm3/s': 'm^3/s',
    },
  },
  length: { si: 'm', units: { m: 'm', ft: 'ft' } },
  diameter: { si: 'm', units: { mm: 'mm', in: 'inch', m: 'm' } },
  pressure: { si: 'Pa', units: { Pa: 'Pa', kPa: 'kPa', bar: 'bar', psi: 'psi' } },
  power: { si: 'W', units: { W: 'W', kW: 'kW', hp: 'hp' } },
  volume: { si: 'm^3', units: { m3: 'm^3', L: 'liter', gal: 'gallon' } },
  velocity: { si: 'm/s', units: { 'm/s': 'm/s', 'ft/s': 'ft/s' } },
};

describe('units', () => {
  // mathjs's psi and hp sit 6e-11 (relative) below the exact pound-force definition used here; the rest agree to rounding
  it("has every factor as mathjs's unit definitions give it, to 1e-10", () => {
    for (const [quantity, { si, units }] of Object.entries(mathjsNames)) {
      const factors = UNIT_FACTORS_TO_SI[quantity as keyof typeof UNIT_FACTORS_TO_SI] as Record<string, number>;
      expect(Object.keys(factors).sort(), quantity).to.deep.equal(Object.keys(units).sort());
      for (const [name, mathjsName] of Object.entries(units)) {
        const expected = unit(1, mathjsName).toNumber(si);
        expect(factors[name], `${quantity} ${name}`).to.be.closeTo(expected, expected * 1e-10);
      }
    }
  });

  it('converts flows by the exact definitions (US gallon 3.785411784 L, NIST SP 811 Appendix B)', () => {
    expect(flowToSI(1, 'gpm')).to.be.closeTo(3.785411784e-3 / 60, 1e-18);
    expect(flowToSI(1, 'gph')).to.be.closeTo(3.785411784e-3 / 3600, 1e-18);
    expect(flowToSI(60, 'L/min')).to.be.closeTo(1e-3, 1e-18);
    expect(flowToSI(1, 'L/s')).to.be.closeTo(1e-3, 1e-18);
    expect(flowToSI(3.6, 'm3/h')).to.be.closeTo(1e-3, 1e-18);
    expect(flowToSI(2.5, 'm3/s')).to.equal(2.5);
  });

  it('100 gpm is 6000 gph (common practice: 1 gpm = 60 gph)', () => {
    expect(flowFromSI(flowToSI(100, 'gpm'), 'gph')).to.be.closeTo(6000, 1e-9);
  });

  it('converts lengths, heads and diameters by the international foot and inch (0.3048 m, 25.4 mm exactly)', () => {
    expect(lengthToSI(1, 'ft')).to.be.closeTo(0.3048, 1e-15);
    expect(headToSI(10, 'ft')).to.be.closeTo(3.048, 1e-14);
    expect(diameterToSI(3.068, 'in')).to.be.closeTo(0.0779272, 1e-15);
    expect(diameterToSI(50, 'mm')).to.be.closeTo(0.05, 1e-15);
    expect(headFromSI(1, 'ft')).to.be.closeTo(1 / 0.3048, 1e-12);
  });

  it('converts pressure to head through the water density (1 psi = 6894.757 Pa, NIST SP 811)', () => {
    expect(pressureToSI(1, 'psi')).to.be.closeTo(6894.757, 1e-3);
    expect(pressureToSI(1, 'bar')).to.equal(1e5);
    const density = waterDensity(20);
    // 1 psi of water at 20 C: 6894.757 / (998.2 * 9.80665) = 0.7043 m = 2.311 ft
    expect(pressureToHead(1, 'psi', density)).to.be.closeTo(6894.757 / (density * 9.80665), 1e-6);
    expect(headFromSI(pressureToHead(1, 'psi', density), 'ft')).to.be.closeTo(2.311, 0.001);
    expect(headToPressure(10, 'kPa', 1000)).to.be.closeTo(98.0665, 1e-9);
  });

  it('round trips every unit to SI and back (property)', () => {
    const value = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
    const pairs: [readonly string[], (v: number, u: never) => number, (v: number, u: never) => number][] = [
      [FLOW_UNITS, flowToSI, flowFromSI],
      [HEAD_UNITS, headToSI, headFromSI],
      [LENGTH_UNITS, lengthToSI, lengthFromSI],
      [DIAMETER_UNITS, diameterToSI, diameterFromSI],
      [PRESSURE_UNITS, pressureToSI, pressureFromSI],
    ];
    for (const [units, toSI, fromSI] of pairs) {
      fc.assert(
        fc.property(value, fc.constantFrom(...units), (v, u) => {
          const back = fromSI(toSI(v, u as never), u as never);
          return Math.abs(back - v) <= 1e-12 * Math.max(1, Math.abs(v));
        }),
      );
    }
  });

  it('converts straight from one unit to another (1 gpm = 3.785411784 L/min; 1 ft = 0.3048 m, NIST SP 811)', () => {
    expect(convertFlow(100, 'gpm', 'L/min')).to.be.closeTo(378.5411784, 1e-9);
    expect(convertFlow(6000, 'gph', 'gpm')).to.be.closeTo(100, 1e-12);
    expect(convertHead(14.5, 'ft', 'm')).to.be.closeTo(4.4196, 1e-12);
    expect(convertLength(73.152, 'm', 'ft')).to.be.closeTo(240, 1e-12);
    expect(() => convertFlow(1, 'gpm', 'cfs' as never)).to.throw(/accepted units: gpm, gph/);
  });

  it('converts volumes and velocities by the same definitions (US gallon 3.785411784 L, foot 0.3048 m, NIST SP 811 Appendix B)', () => {
    expect(volumeToSI(1000, 'gal')).to.be.closeTo(3.785411784, 1e-12);
    expect(volumeToSI(250, 'L')).to.be.closeTo(0.25, 1e-15);
    expect(volumeFromSI(1, 'gal')).to.be.closeTo(264.172052358, 1e-9);
    expect(velocityToSI(5, 'ft/s')).to.be.closeTo(1.524, 1e-15);
    expect(velocityFromSI(1.524, 'ft/s')).to.be.closeTo(5, 1e-14);
    expect(convertDiameter(25.4, 'mm', 'in')).to.be.closeTo(1, 1e-15);
    expect(refusalOf(() => volumeToSI(1, 'ft3' as never))).to.deep.include({
      code: 'unknown-unit',
      params: { quantity: 'volume', value: 'ft3', accepted: ['m3', 'L', 'gal'] },
    });
  });

  it('names the accepted units when a unit is unknown', () => {
    expect(refusalOf(() => flowToSI(1, 'cfs' as FlowUnit))).to.deep.equal({
      code: 'unknown-unit',
      params: { quantity: 'flow', value: 'cfs', accepted: ['gpm', 'gph', 'L/h', 'L/min', 'L/s', 'm3/h', 'm3/s'] },
      pointer: '/flowUnit',
    });
    expect(refusalOf(() => headToSI(1, 'yd' as never)).params).to.deep.include({ accepted: ['m', 'ft'] });
    expect(refusalOf(() => flowToSI(Number.NaN, 'gpm')).code).to.equal('not-finite');
    expect(() => flowToSI(1, 'toString' as FlowUnit)).to.throw(HydraulicsInputError);
  });
});
