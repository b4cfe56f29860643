import { expect } from 'chai';
import {
  cableVoltageDrop,
  conductorById,
  conductorResistance,
  CONDUCTORS,
  COPPER_TEMPERATURE_COEFFICIENT,
  smallestConductorForDrop,
  type CableRun,
} from '../../shared/electrical';
import { HydraulicsInputError, lengthToSI } from '../../shared/hydraulics';

/*
 * The voltage drop of a copper run and the conductor tables behind it. The tables' figures are
 * quoted from memory (NEC Chapter 9 Table 8, IEC 60228 Table 2), so they are checked against
 * physics that owes nothing to either table: the AWG closed form for areas, and the resistivity of
 * annealed copper over the area for resistances.
 */

/** AWG diameter by its defining closed form, d = 0.127 mm x 92^((36 - n)/39); n = -1 for 2/0, etc. (ASTM B258). */
function awgDiameterMm(size: string): number {
  const n = size.endsWith('/0') ? 1 - Number(size.split('/')[0]) : Number(size);
  return 0.127 * 92 ** ((36 - n) / 39);
}

/** Annealed copper's resistivity at 20 C, ohm m: 1/58 ohm mm2/m, the International Annealed Copper Standard (IEC 60028). */
const COPPER_RESISTIVITY_20C = 1 / 58e6;

function refused(compute: () => unknown): HydraulicsInputError {
  try {
    compute();
  } catch (error) {
    if (error instanceof HydraulicsInputError) return error;
    throw error;
  }
  throw new Error('not refused');
}

const feet = (value: number) => lengthToSI(value, 'ft');

describe('copper conductor tables', () => {
  const awg = CONDUCTORS.filter((conductor) => conductor.series === 'awg');
  const metric = CONDUCTORS.filter((conductor) => conductor.series === 'metric');

  it('hold AWG 14 to 4/0 and metric 1.5 to 95 mm2 at least, each series growing in area', () => {
    for (const id of ['awg-14', 'awg-12', 'awg-1/0', 'awg-4/0', 'mm2-1.5', 'mm2-2.5', 'mm2-95']) conductorById(id);
    for (const series of [awg, metric]) {
      for (let index = 1; index < series.length; index += 1) {
        expect(series[index].area).to.be.greaterThan(series[index - 1].area);
        expect(series[index].resistance).to.be.lessThan(series[index - 1].resistance);
      }
    }
  });

  it('give each AWG area within 0.5 % of the closed form d = 0.127 mm x 92^((36 - n)/39)', () => {
    expect(awg.length).to.be.at.least(13);
    for (const conductor of awg) {
      const size = conductor.id.slice('awg-'.length);
      const closedForm = (Math.PI * (awgDiameterMm(size) * 1e-3) ** 2) / 4;
      expect(conductor.area / closedForm, conductor.label).to.be.closeTo(1, 0.005);
    }
  });

  it('give AWG resistances at 75 C 0-5 % above solid copper rho/A (stranding lengthens the strands)', () => {
    const rho75 = COPPER_RESISTIVITY_20C * (1 + COPPER_TEMPERATURE_COEFFICIENT * 55);
    for (const conductor of awg) {
      const ratio = conductorResistance(conductor, 75) / (rho75 / conductor.area);
      expect(ratio, conductor.label).to.be.within(1, 1.05);
    }
  });

  it('give metric maximum resistances at 20 C 0-15 % above rho/A of the nominal area (IEC sets resistance, not area)', () => {
    for (const conductor of metric) {
      const ratio = conductorResistance(conductor, 20) / (COPPER_RESISTIVITY_20C / conductor.area);
      expect(ratio, conductor.label).to.be.within(1, 1.15);
    }
  });

  it('correct resistance for temperature with a = 0.00393/K from either table temperature', () => {
    const metric25 = conductorById('mm2-2.5');
    // by hand: 7.41 ohm/km x (1 + 0.00393 x 50) = 8.866 ohm/km at 70 C
    expect(conductorResistance(metric25, 70) * 1000).to.be.closeTo(8.866, 0.001);
    // by hand: 12 AWG 1.98 ohm/kft at 75 C is 1.98 / (1 + 0.00393 x 55) = 1.628 ohm/kft at 20 C
    expect(conductorResistance(conductorById('awg-12'), 20) * feet(1000)).to.be.closeTo(1.628, 0.001);
    expect(refused(() => conductorResistance(metric25, 300)).field).to.equal('/conductorTemperature');
  });

  it('refuses an unknown conductor id, listing the ids', () => {
    const error = refused(() => conductorById('awg-13', '/conductor'));
    expect(error.issue.code).to.equal('unknown-conductor');
    expect(error.field).to.equal('/conductor');
    expect(error.message).to.contain('awg-12').and.contain('mm2-2.5');
  });
});

describe('voltage drop of a copper run', () => {
  it('reproduces a published example: two-wire, 100 ft, No. 16 copper (4.99 ohm/kft), 4 A: 4.0 V, 16.7 % of 24 V', () => {
    // Electrician2.com training notes, "Voltage drop" (the example under NEC Chapter 9 Table 8)
    const drop = cableVoltageDrop({ current: 4, voltage: 24, phases: 1, length: feet(100) }, conductorById('awg-16'));
    expect(drop.volts).to.be.closeTo(4.0, 0.05);
    // the source divides its rounded 4.0 V by 24 V; unrounded, 3.992 V is 16.63 %
    expect(drop.percent).to.be.closeTo(16.7, 0.1);
  });

  it('three phase by hand: 10 A, 400 V, 100 m of 4 mm2 at 75 C drops sqrt(3) x 100 x 10 x 5.6065e-3 = 9.711 V', () => {
    const drop = cableVoltageDrop({ current: 10, voltage: 400, phases: 3, length: 100 }, conductorById('mm2-4'));
    expect(drop.volts).to.be.closeTo(9.711, 0.001);
    expect(drop.percent).to.be.closeTo(2.428, 0.001);
  });

  it('single phase by hand: 8 A, 230 V, 40 m of 1.5 mm2 at 75 C drops 2 x 40 x 8 x 14.715e-3 = 9.418 V (4.09 %)', () => {
    // 12.1 ohm/km x (1 + 0.00393 x 55) = 14.715 ohm/km
    const drop = cableVoltageDrop({ current: 8, voltage: 230, phases: 1, length: 40 }, conductorById('mm2-1.5'));
    expect(drop.volts).to.be.closeTo(9.418, 0.001);
    expect(drop.percent).to.be.closeTo(4.095, 0.001);
  });

  it('grows in proportion to length and current, and a cooler conductor drops less', () => {
    const run: CableRun = { current: 6, voltage: 230, phases: 1, length: 25 };
    const conductor = conductorById('mm2-2.5');
    const base = cableVoltageDrop(run, conductor).volts;
    expect(cableVoltageDrop({ ...run, length: 50 }, conductor).volts).to.be.closeTo(2 * base, 1e-12);
    expect(cableVoltageDrop({ ...run, current: 18 }, conductor).volts).to.be.closeTo(3 * base, 1e-12);
    expect(cableVoltageDrop({ ...run, conductorTemperature: 20 }, conductor).volts).to.be.lessThan(base);
  });

  it('refuses a run it cannot size, naming the input: 0 V, negative length, two phases, no current', () => {
    const good: CableRun = { current: 6, voltage: 230, phases: 1, length: 25 };
    const conductor = conductorById('mm2-2.5');
    const cases: Array<[Partial<CableRun> | { phases: number }, string, string]> = [
      [{ voltage: 0 }, '/voltage', 'not-positive'],
      [{ length: -3 }, '/length', 'not-positive'],
      [{ phases: 2 }, '/phases', 'unknown-phases'],
      [{ current: Number.NaN }, '/current', 'not-finite'],
    ];
    for (const [change, pointer, code] of cases) {
      const error = refused(() => cableVoltageDrop({ ...good, ...change } as CableRun, conductor));
      expect([error.field, error.issue.code]).to.deep.equal([pointer, code]);
    }
  });
});

describe('smallest conductor for a voltage-drop limit', () => {
  const run: CableRun = { current: 12, voltage: 230, phases: 1, length: 60 };

  it('picks the first branch-circuit size meeting the limit: the one below it misses (brute force over each series)', () => {
    for (const series of ['awg', 'metric'] as const) {
      for (const limit of [1, 2, 3, 5]) {
        const chosen = smallestConductorForDrop(series, run, limit);
        expect(chosen.percent).to.be.at.most(limit);
        const smaller = CONDUCTORS.filter(
          (conductor) =>
            conductor.series === series && conductor.branchCircuit && conductor.area < chosen.conductor.area,
        );
        for (const conductor of smaller) expect(cableVoltageDrop(run, conductor).percent).to.be.greaterThan(limit);
      }
    }
  });

  it('never offers a size under 14 AWG or 1.5 mm2 for a pump, however short the run', () => {
    const short: CableRun = { current: 1, voltage: 230, phases: 1, length: 1 };
    expect(smallestConductorForDrop('awg', short).conductor.label).to.equal('14 AWG');
    expect(smallestConductorForDrop('metric', short).conductor.label).to.equal('1.5 mm2');
  });

  it('uses 3 % unless told: 12 A at 230 V over 60 m needs 6 mm2 (4 mm2 drops 3.5 %, by hand)', () => {
    // 4 mm2 at 75 C: 5.6065 ohm/km x 2 x 60 x 12 = 8.07 V = 3.51 %; 6 mm2: 3.7457 ohm/km -> 5.39 V = 2.35 %
    const chosen = smallestConductorForDrop('metric', run);
    expect(chosen.conductor.id).to.equal('mm2-6');
    expect(chosen.percent).to.be.closeTo(2.345, 0.001);
  });

  it('refuses when even the largest size misses, and refuses a limit outside 0.1-25 %', () => {
    const long: CableRun = { current: 80, voltage: 120, phases: 1, length: 2000 };
    const error = refused(() => smallestConductorForDrop('awg', long));
    expect(error.issue.code).to.equal('no-conductor-meets-limit');
    expect(error.field).to.equal('/length');
    expect(error.message).to.contain('4/0 AWG');
    expect(refused(() => smallestConductorForDrop('metric', run, 0)).field).to.equal('/maxDropPercent');
    expect(refused(() => smallestConductorForDrop('metric', run, 40)).field).to.equal('/maxDropPercent');
  });
});
