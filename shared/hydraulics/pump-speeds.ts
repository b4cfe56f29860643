/*
 * The speeds a pump may run at: its nominal speed (the speed its published curve is for), a
 * continuous range on a drive or controller, and the fixed speeds of a multi-speed motor. Ratios
 * are N / N_nominal; the curve at a ratio is pumpCurveAtSpeed (affinity-laws.ts).
 */

/** A pump's speeds, rpm; each null when the catalog gives none. */
export interface PumpSpeeds {
  nominalRpm: number | null;
  /** A continuous range, min < max, the nominal speed inside it. */
  rangeRpm: { min: number; max: number } | null;
  /** The fixed speeds of a multi-speed pump, ascending, each at most the nominal speed. */
  fixedRpm: readonly number[] | null;
}

/**
 * The highest speed ratio Riffle scales a curve to. A drive may run a pump above its mains speed,
 * but the motor's power grows as N^3 (20 % over speed draws 1.73 times the power) and the pump's
 * own speed limit is the maker's: Riffle's own bound, common practice for pond and station drives.
 */
export const MAX_SPEED_RATIO = 1.2;

/**
 * Below this ratio a point at speed carries a caution. The affinity laws hold efficiency
 * unchanged, which holds for moderate changes only: well below 60 % of speed, losses that do not
 * scale with N (disc friction, leakage, the motor and drive) lower the efficiency; a motor cooled
 * by its own fan runs hot at low speed; and on a system with static head the point runs towards
 * shut-off, under the pump's minimum flow. Common practice (drive guidance for centrifugal pumps
 * puts the floor at some 50-60 % of speed); recalled, not from a standard.
 */
export const LOW_SPEED_CAUTION_RATIO = 0.6;

/**
 * Whether the catalog gives the pump more speeds than its nominal one (a range or fixed speeds,
 * beside a nominal speed to scale from).
 * @param speeds - the pump's speeds, rpm
 * @returns true for a variable- or multi-speed pump
 * @example
 * hasSpeedChoice({ nominalRpm: 2900, rangeRpm: { min: 1450, max: 2900 }, fixedRpm: null }) // => true
 * hasSpeedChoice({ nominalRpm: 2900, rangeRpm: null, fixedRpm: null }) // => false
 */
export function hasSpeedChoice(speeds: PumpSpeeds): boolean {
  return speeds.nominalRpm !== null && (speeds.rangeRpm !== null || (speeds.fixedRpm?.length ?? 0) > 0);
}

/** Ratios within this of an allowed speed count as that speed (rpm are whole numbers). */
const SPEED_MATCH_RPM = 0.5;

/**
 * Whether a pump may run at `ratio`: its nominal speed always; else within its range or at one of
 * its fixed speeds (to half an rpm).
 * @param speeds - the pump's speeds, rpm
 * @param ratio - N / N_nominal, dimensionless
 * @returns true when the catalog allows that speed
 * @example
 * const speeds = { nominalRpm: 2900, rangeRpm: { min: 1450, max: 3200 }, fixedRpm: null }
 * speedRatioAllowed(speeds, 0.5) // => true
 * speedRatioAllowed(speeds, 0.45) // => false
 * speedRatioAllowed({ nominalRpm: 2900, rangeRpm: null, fixedRpm: [1450, 2900] }, 0.5) // => true
 */
export function speedRatioAllowed(speeds: PumpSpeeds, ratio: number): boolean {
  const nominal = speeds.nominalRpm;
  if (nominal === null) return ratio === 1;
  const rpm = ratio * nominal;
  if (Math.abs(rpm - nominal) <= SPEED_MATCH_RPM) return true;
  const range = speeds.rangeRpm;
  if (range && rpm >= range.min - SPEED_MATCH_RPM && rpm <= range.max + SPEED_MATCH_RPM) return true;
  return (speeds.fixedRpm ?? []).some((fixed) => Math.abs(fixed - rpm) <= SPEED_MATCH_RPM);
}

/**
 * The speed ratio a pump runs at when its duty needs `neededRatio` (e.g. from
 * speedRatioForDutyPoint): within a range, the needed ratio kept inside it; with fixed speeds
 * only, the lowest fixed speed (or the nominal one) at or above the needed one, else the highest.
 * @param speeds - the pump's speeds (nominalRpm not null)
 * @param neededRatio - N / N_nominal the duty asks for, dimensionless (> 0)
 * @returns the ratio to run at, dimensionless
 * @example
 * speedRatioToRun({ nominalRpm: 2900, rangeRpm: { min: 1450, max: 2900 }, fixedRpm: null }, 0.4) // => 0.5
 * speedRatioToRun({ nominalRpm: 2900, rangeRpm: null, fixedRpm: [1450, 2175] }, 0.6) // => 0.75
 * speedRatioToRun({ nominalRpm: 2900, rangeRpm: null, fixedRpm: [1450, 2175] }, 1.1) // => 1
 */
export function speedRatioToRun(speeds: PumpSpeeds, neededRatio: number): number {
  const nominal = speeds.nominalRpm ?? 1;
  const range = speeds.rangeRpm;
  if (range) return Math.min(Math.max(neededRatio, range.min / nominal), range.max / nominal);
  const ratios = [...(speeds.fixedRpm ?? []).map((rpm) => rpm / nominal), 1].sort((a, b) => a - b);
  return ratios.find((ratio) => ratio >= neededRatio) ?? ratios[ratios.length - 1];
}
