import { HydraulicsInputError, requireInRange, requirePositive } from '../hydraulics/hydraulics-error';
import {
  conductorResistance,
  CONDUCTORS,
  DEFAULT_CONDUCTOR_TEMPERATURE,
  type Conductor,
  type ConductorSeries,
} from './conductor-tables';

/*
 * The voltage a copper cable run loses at a pump's current, and the smallest conductor that keeps
 * it under a limit. Resistive only: reactance is neglected. That is fair for the sizes a pump's
 * branch circuit uses (up to about 1/0 AWG or 50 mm2, where a conductor's reactance, some
 * 0.08 ohm/km, is a small part of its resistance) and at a motor's power factor of 0.8 or more, where
 * the resistive figure R I L is at or above the true R cos(phi) + X sin(phi) one; for larger
 * conductors, or a power factor well under 0.8, the true drop can exceed this one.
 */

/** A cable run from the supply to a pump. */
export interface CableRun {
  /** The pump's full-load current, A. */
  current: number;
  /** Nominal supply voltage, V: line to neutral (or line to line) for single phase, line to line for three phase. */
  voltage: number;
  phases: 1 | 3;
  /** One-way length from the supply to the pump, m (the return path is counted by the formula). */
  length: number;
  /** Conductor temperature, C; default 75 (DEFAULT_CONDUCTOR_TEMPERATURE). */
  conductorTemperature?: number;
}

/** A run's drop through one conductor size. */
export interface CableDrop {
  conductor: Conductor;
  /** V */
  volts: number;
  /** Share of the nominal voltage, percent. */
  percent: number;
}

/**
 * The limit of voltage drop a branch circuit is sized to unless stated, percent of nominal voltage:
 * 3 %, common practice as NFPA 70 (NEC) 210.19(A) Informational Note No. 4 recommends it (not a rule of the code).
 */
export const DEFAULT_MAX_DROP_PERCENT = 3;

/**
 * Checks a cable run: current, voltage and length greater than zero, one or three phases.
 * @param run - the run (A, V, m)
 * @returns the same run, checked
 * @example
 * checkCableRun({ current: 8, voltage: 230, phases: 1, length: 40 }).phases // => 1
 */
export function checkCableRun(run: CableRun): CableRun {
  requirePositive(run.current, '/current', 'current');
  requirePositive(run.voltage, '/voltage', 'voltage');
  requirePositive(run.length, '/length', 'cable length');
  if (run.phases !== 1 && run.phases !== 3)
    throw new HydraulicsInputError({ code: 'unknown-phases', params: { value: run.phases }, pointer: '/phases' });
  if (run.conductorTemperature !== undefined)
    requireInRange(run.conductorTemperature, -20, 120, '/conductorTemperature', 'conductor temperature');
  return run;
}

/**
 * Voltage drop of a copper run through one conductor size, resistive only: single phase
 * VD = 2 L I R (out and back), three phase VD = sqrt(3) L I R (line to line, balanced load), R the
 * conductor's DC resistance per metre at the run's temperature (NFPA 70 (NEC) Chapter 9 Table 8 and
 * its note; the same formulas as IEC 60364-5-52:2009 Annex G, G.1, with reactance set to zero and
 * cos(phi) to 1). Reactance is neglected: see this file's note on when that is fair.
 * @param run - the run: current A, voltage V, phases, one-way length m
 * @param conductor - a conductor of CONDUCTORS
 * @returns the drop, V and percent of the nominal voltage
 * @example
 * // single phase, 12 AWG (1.98 ohm/kft), 16 A, 100 ft one way: 2 x 100 x 16 x 1.98 / 1000 = 6.336 V
 * cableVoltageDrop({ current: 16, voltage: 120, phases: 1, length: 30.48 }, conductorById('awg-12')).volts // => 6.336
 * // three phase, 4 mm2 (4.61 ohm/km at 20 C, 5.606 at 75 C), 10 A, 100 m: 1.732 x 100 x 10 x 5.606e-3 = 9.711 V
 * cableVoltageDrop({ current: 10, voltage: 400, phases: 3, length: 100 }, conductorById('mm2-4')).percent // => 2.428
 */
export function cableVoltageDrop(run: CableRun, conductor: Conductor): CableDrop {
  checkCableRun(run);
  const resistance = conductorResistance(conductor, run.conductorTemperature ?? DEFAULT_CONDUCTOR_TEMPERATURE);
  const factor = run.phases === 3 ? Math.sqrt(3) : 2;
  const volts = factor * run.length * run.current * resistance;
  return { conductor, volts, percent: (100 * volts) / run.voltage };
}

/**
 * The smallest branch-circuit conductor of a series whose drop on the run is at or under the limit
 * (cableVoltageDrop for each size, smallest first, from 14 AWG or 1.5 mm2); refuses with
 * `no-conductor-meets-limit` (pointer `/length`) when even the largest of the series is not enough.
 * Voltage drop only: ampacity, overcurrent protection and the motor-circuit rules decide too.
 * @param series - `awg` or `metric`
 * @param run - the run: current A, voltage V, phases, one-way length m
 * @param maxDropPercent - the limit, percent of nominal voltage, 0.1 to 25 (default 3, DEFAULT_MAX_DROP_PERCENT)
 * @returns the smallest size meeting the limit, with its drop
 * @example
 * // 16 A at 120 V over 100 ft: 12 AWG drops 5.3 %, 10 AWG 3.3 %, 8 AWG 2.1 %; under 5 %: 2.5 mm2 7.3 %, 4 mm2 4.6 %
 * smallestConductorForDrop('awg', { current: 16, voltage: 120, phases: 1, length: 30.48 }).conductor.label // => '8 AWG'
 * smallestConductorForDrop('metric', { current: 16, voltage: 120, phases: 1, length: 30.48 }, 5).conductor.label // => '4 mm2'
 */
export function smallestConductorForDrop(
  series: ConductorSeries,
  run: CableRun,
  maxDropPercent = DEFAULT_MAX_DROP_PERCENT,
): CableDrop {
  checkCableRun(run);
  requireInRange(maxDropPercent, 0.1, 25, '/maxDropPercent', 'largest voltage drop (percent)');
  const drops = CONDUCTORS.filter((conductor) => conductor.series === series && conductor.branchCircuit)
    .sort((a, b) => a.area - b.area)
    .map((conductor) => cableVoltageDrop(run, conductor));
  const fitting = drops.find((drop) => drop.percent <= maxDropPercent);
  if (fitting) return fitting;
  const largest = drops[drops.length - 1];
  throw new HydraulicsInputError({
    code: 'no-conductor-meets-limit',
    params: { series, maxDropPercent, largest: largest.conductor.label, largestDropPercent: largest.percent },
    pointer: '/length',
  });
}
