import { HydraulicsInputError, requireInRange } from '../hydraulics/hydraulics-error';
import { lengthToSI } from '../hydraulics/units';

/*
 * Copper conductor sizes in two series, each with its cross-section and its DC resistance at the
 * temperature its table states. AWG sizes from NFPA 70 (NEC), 2023 ed., Chapter 9 Table 8
 * (stranded, uncoated copper, DC resistance at 75 C); metric sizes from IEC 60228:2004 Table 2
 * (class 2 stranded, plain copper, maximum DC resistance at 20 C). Both tables' figures are
 * quoted from memory: no copy of either standard was at hand. The suite checks them against
 * independent physics (the AWG closed form for areas; copper's resistivity over area for
 * resistances), so a mistyped figure fails.
 */

/** The two conductor series Riffle sizes in. */
export const CONDUCTOR_SERIES = ['awg', 'metric'] as const;
export type ConductorSeries = (typeof CONDUCTOR_SERIES)[number];

/** Copper's temperature coefficient of resistance at 20 C, 1/K (IEC 60228:2004 Annex B; IEC 60028 annealed copper). */
export const COPPER_TEMPERATURE_COEFFICIENT = 0.00393;

/** The conductor temperature resistances are taken at unless stated: 75 C, the column NEC Table 8 gives. */
export const DEFAULT_CONDUCTOR_TEMPERATURE = 75;

export interface Conductor {
  /** `awg-12`, `awg-1/0`, `mm2-2.5` */
  id: string;
  series: ConductorSeries;
  /** As the trade writes it: `12 AWG`, `1/0 AWG`, `2.5 mm2`. */
  label: string;
  /** Cross-section, m2. */
  area: number;
  /** DC resistance of one conductor, ohm per metre, at `resistanceTemperature`. */
  resistance: number;
  /** The temperature the table gives `resistance` at, C. */
  resistanceTemperature: number;
  /**
   * Whether the size may feed a pump's branch circuit: 14 AWG and up (NEC 240.4(D), the small-conductor
   * rule), 1.5 mm2 and up (IEC 60364-5-52 Table 52.2, power circuits); smaller ones are listed only
   * for checks such as control wiring.
   */
  branchCircuit: boolean;
}

/** Ohm per 1000 ft to ohm per metre. */
function perKilofoot(ohms: number): number {
  return ohms / lengthToSI(1000, 'ft');
}

/** NEC Chapter 9 Table 8: size, area (mm2), stranded uncoated copper ohm/kft at 75 C (from memory). */
const AWG_TABLE_8: ReadonlyArray<[string, number, number]> = [
  ['18', 0.823, 7.95],
  ['16', 1.31, 4.99],
  ['14', 2.08, 3.14],
  ['12', 3.31, 1.98],
  ['10', 5.261, 1.24],
  ['8', 8.367, 0.778],
  ['6', 13.3, 0.491],
  ['4', 21.15, 0.308],
  ['3', 26.67, 0.245],
  ['2', 33.62, 0.194],
  ['1', 42.41, 0.154],
  ['1/0', 53.49, 0.122],
  ['2/0', 67.43, 0.0967],
  ['3/0', 85.01, 0.0766],
  ['4/0', 107.2, 0.0608],
];

/** IEC 60228 Table 2, class 2 plain copper: nominal area (mm2) and maximum ohm/km at 20 C (from memory). */
const IEC_60228_CLASS_2: ReadonlyArray<[number, number]> = [
  [1, 18.1],
  [1.5, 12.1],
  [2.5, 7.41],
  [4, 4.61],
  [6, 3.08],
  [10, 1.83],
  [16, 1.15],
  [25, 0.727],
  [35, 0.524],
  [50, 0.387],
  [70, 0.268],
  [95, 0.193],
  [120, 0.153],
  [150, 0.124],
  [185, 0.0991],
  [240, 0.0754],
  [300, 0.0601],
];

/** Every conductor Riffle knows, AWG from 18 to 4/0 then metric from 1 to 300 mm2, each series smallest first. */
export const CONDUCTORS: readonly Conductor[] = [
  ...AWG_TABLE_8.map(([size, mm2, ohmsPerKft]) => ({
    id: `awg-${size}`,
    series: 'awg' as const,
    label: `${size} AWG`,
    area: mm2 * 1e-6,
    resistance: perKilofoot(ohmsPerKft),
    resistanceTemperature: 75,
    branchCircuit: mm2 >= 2,
  })),
  ...IEC_60228_CLASS_2.map(([mm2, ohmsPerKm]) => ({
    id: `mm2-${mm2}`,
    series: 'metric' as const,
    label: `${mm2} mm2`,
    area: mm2 * 1e-6,
    resistance: ohmsPerKm / 1000,
    resistanceTemperature: 20,
    branchCircuit: mm2 >= 1.5,
  })),
];

/**
 * The conductor with this id, or a refusal `unknown-conductor` listing the ids.
 * @param id - a conductor id, e.g. `awg-12` or `mm2-2.5`
 * @param field - JSON pointer the refusal names
 * @returns the conductor
 * @example
 * conductorById('mm2-2.5').label // => '2.5 mm2'
 * conductorById('awg-1/0').series // => 'awg'
 */
export function conductorById(id: string, field = '/conductor'): Conductor {
  const found = CONDUCTORS.find((conductor) => conductor.id === id);
  if (!found)
    throw new HydraulicsInputError({
      code: 'unknown-conductor',
      params: { value: id, accepted: CONDUCTORS.map((conductor) => conductor.id) },
      pointer: field,
    });
  return found;
}

/**
 * DC resistance of one conductor at a temperature, ohm/m, taken from its table's temperature by
 * R_T = R_ref (1 + a (T - 20)) / (1 + a (T_ref - 20)), a = 0.00393/K for copper at 20 C (IEC 60228:2004
 * Annex B; the same correction as NEC Chapter 9 Table 8 note 2, whose a = 0.00323/K is referred to 75 C).
 * Valid over the temperatures insulation allows, -20 to 120 C.
 * @param conductor - a conductor of CONDUCTORS
 * @param temperature - conductor temperature, C (default 75, DEFAULT_CONDUCTOR_TEMPERATURE)
 * @returns resistance, ohm/m
 * @example
 * // IEC 60228: 2.5 mm2 at most 7.41 ohm/km at 20 C; at 75 C: 7.41 x 1.21615 = 9.012 ohm/km
 * conductorResistance(conductorById('mm2-2.5'), 75) // => 9.012e-3
 * // NEC Table 8: 12 AWG 1.98 ohm/kft at 75 C = 6.496 ohm/km
 * conductorResistance(conductorById('awg-12')) // => 6.496e-3
 */
export function conductorResistance(conductor: Conductor, temperature = DEFAULT_CONDUCTOR_TEMPERATURE): number {
  requireInRange(temperature, -20, 120, '/conductorTemperature', 'conductor temperature');
  const a = COPPER_TEMPERATURE_COEFFICIENT;
  return (conductor.resistance * (1 + a * (temperature - 20))) / (1 + a * (conductor.resistanceTemperature - 20));
}
