import { requireFinite, requireInRange, requireNonNegative, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import { waterDensity, waterVapourPressure } from './water-properties';

/*
 * Net positive suction head for pumps that draw from an open water surface.
 */

/**
 * Pressure of the ICAO standard atmosphere at `altitude` (m above sea level),
 * Pa absolute: p = 101325 (1 - 2.25577e-5 h)^5.25588. Source: ISO 2533:1975
 * (ICAO Doc 7488), troposphere; valid -500 to 11000 m.
 * @param altitude - height above mean sea level, m (-500 to 11000)
 * @returns atmospheric pressure, Pa absolute
 * @example
 * // the ICAO/ISO standard atmosphere tabulates 89 875 Pa at 1000 m (quoted from memory); python3-fluids 1.0.22
 * // ATMOSPHERE_1976(1000).P (the same troposphere, unrounded constants) gives 89876.3 Pa
 * standardAtmosphericPressure(0) // => 101325
 * standardAtmosphericPressure(1000) // => 89875
 */
export function standardAtmosphericPressure(altitude: number): number {
  requireInRange(altitude, -500, 11000, '/altitude', 'altitude (m)');
  return 101325 * Math.pow(1 - 2.25577e-5 * altitude, 5.25588);
}

export interface SuctionConditions {
  /** Absolute pressure on the water surface, Pa (see standardAtmosphericPressure). */
  surfacePressure: number;
  /** Water temperature, C (0-40). */
  temperature: number;
  /** Height of the water surface above the pump's impeller eye, m; negative for a suction lift. */
  surfaceElevation: number;
  /** Friction and fitting losses of the suction pipe at the operating flow, m. */
  suctionLosses: number;
}

/**
 * NPSH available, m: NPSHa = (p_surface - p_vapour)/(rho g) + z_s - h_f,s,
 * with p_vapour and rho of the water at its temperature (water-properties).
 * Source: ANSI/HI 9.6.1 (Rotodynamic Pumps - Guideline for NPSH Margin);
 * Karassik, Pump Handbook, 4th ed., NPSH chapter. Valid for water 0-40 C drawn from an open
 * surface (or a vessel at a known absolute pressure).
 * @param conditions - surface pressure (Pa absolute), temperature (C), surface height above the
 *   impeller eye (m, negative for a lift) and suction losses (m)
 * @returns NPSH available, m
 * @example
 * // sea level, 20 C, 2 m suction lift, 0.5 m suction losses; by hand with the IAPWS values
 * // (101325 - 2339.2) / (998.206 x 9.80665) - 2 - 0.5 = 7.6119 m
 * npshAvailable({ surfacePressure: 101325, temperature: 20, surfaceElevation: -2, suctionLosses: 0.5 }) // => 7.6119
 */
export function npshAvailable(conditions: SuctionConditions): number {
  requirePositive(conditions.surfacePressure, '/surfacePressure', 'surface pressure');
  requireFinite(conditions.surfaceElevation, '/surfaceElevation', 'surface elevation');
  requireNonNegative(conditions.suctionLosses, '/suctionLosses', 'suction losses');
  const density = waterDensity(conditions.temperature);
  const vapourPressure = waterVapourPressure(conditions.temperature);
  return (
    (conditions.surfacePressure - vapourPressure) / (density * STANDARD_GRAVITY) +
    conditions.surfaceElevation -
    conditions.suctionLosses
  );
}

export interface NpshGuidance {
  /** Least NPSHa / NPSHr. */
  ratio: number;
  /** Least NPSHa - NPSHr, m. */
  difference: number;
}

/**
 * Clean-water guidance of ANSI/HI 9.6.1: NPSH margin ratio of at least 1.1
 * and at least 0.6 m; Riffle requires both (the greater margin governs).
 * @example
 * DEFAULT_NPSH_GUIDANCE.ratio // => 1.1
 * DEFAULT_NPSH_GUIDANCE.difference // => 0.6
 */
export const DEFAULT_NPSH_GUIDANCE: NpshGuidance = Object.freeze({ ratio: 1.1, difference: 0.6 });

export interface NpshMargin {
  ratio: number;
  /** m */
  difference: number;
  adequate: boolean;
}

/**
 * Margin of NPSH available over NPSH required: ratio NPSHa / NPSHr and difference NPSHa - NPSHr,
 * adequate when both meet `guidance` (ANSI/HI 9.6.1 clean-water guidance by default).
 * @param available - NPSH available, m
 * @param required - NPSH required (NPSH3), m (> 0)
 * @param guidance - least ratio and least difference (m); DEFAULT_NPSH_GUIDANCE 1.1 and 0.6 m
 * @returns ratio, difference (m) and whether the margin is adequate
 * @example
 * // by hand: 7.6 / 3 = 2.5333, 4.6 m; 3.2 m over 3 m is 1.067 < 1.1, not adequate
 * npshMargin(7.6, 3).ratio // => 2.5333
 * npshMargin(7.6, 3).adequate // => true
 * npshMargin(3.2, 3).adequate // => false
 */
export function npshMargin(
  available: number,
  required: number,
  guidance: NpshGuidance = DEFAULT_NPSH_GUIDANCE,
): NpshMargin {
  requireFinite(available, '/npshAvailable', 'NPSH available');
  requirePositive(required, '/npshRequired', 'NPSH required');
  const ratio = available / required;
  const difference = available - required;
  return { ratio, difference, adequate: ratio >= guidance.ratio && difference >= guidance.difference };
}
