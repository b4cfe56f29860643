import { requireInRange } from './hydraulics-error';

/*
 * Properties of liquid water at atmospheric pressure, 0-40 C, the range of
 * outdoor water features. Each correlation is checked in the tests against
 * IAPWS-95 / IAPWS 2008 values.
 */

/** Lowest water temperature the engine accepts, C. */
export const WATER_TEMPERATURE_MIN = 0;
/** Highest water temperature the engine accepts, C. */
export const WATER_TEMPERATURE_MAX = 40;

function checkTemperature(temperature: number, field: string): void {
  requireInRange(temperature, WATER_TEMPERATURE_MIN, WATER_TEMPERATURE_MAX, field, 'water temperature (C)');
}

/**
 * Density of air-free water at 101.325 kPa, kg/m3.
 *
 * Kell's equation:
 *   rho = (999.83952 + 16.945176 t - 7.9870401e-3 t^2 - 46.170461e-6 t^3
 *          + 105.56302e-9 t^4 - 280.54253e-12 t^5) / (1 + 16.879850e-3 t)
 * with t in C. Source: G. S. Kell, "Density, thermal expansivity, and
 * compressibility of liquid water from 0 to 150 C", J. Chem. Eng. Data 20(1),
 * 97-105 (1975). Coefficients quoted from memory; the tests hold the result
 * within 0.02 kg/m3 of IAPWS-95 at 10, 20 and 30 C.
 * Valid 0-150 C; accepted here 0-40 C.
 */
export function waterDensity(temperature: number, field = '/temperature'): number {
  checkTemperature(temperature, field);
  const t = temperature;
  const numerator =
    999.83952 + t * (16.945176 + t * (-7.9870401e-3 + t * (-46.170461e-6 + t * (105.56302e-9 + t * -280.54253e-12))));
  return numerator / (1 + 16.87985e-3 * t);
}

/** Dynamic viscosity of water at 20 C and 0.1 MPa, Pa s (ISO/TR 3666:1998; IAPWS 2008 gives 1.0016 mPa s). */
const VISCOSITY_AT_20C = 1.0016e-3;

/**
 * Dynamic viscosity of water at 101.325 kPa, Pa s.
 *
 * Kestin-Sokolov-Wakeham correlation relative to 20 C:
 *   log10(mu_t / mu_20) = (20 - t)/(t + 96) * [1.2364 - 1.37e-3 (20 - t) + 5.7e-6 (20 - t)^2]
 * with t in C and mu_20 = 1.0016 mPa s. Source: J. Kestin, M. Sokolov,
 * W. A. Wakeham, "Viscosity of liquid water in the range -8 C to 150 C",
 * J. Phys. Chem. Ref. Data 7(3), 941-948 (1978); adopted in ISO/TR 3666.
 * Coefficients quoted from memory; the tests hold the result within 0.2 %
 * of IAPWS 2008 at 10, 20 and 30 C. Accepted here 0-40 C.
 */
export function waterDynamicViscosity(temperature: number, field = '/temperature'): number {
  checkTemperature(temperature, field);
  const below20 = 20 - temperature;
  const exponent = (below20 / (temperature + 96)) * (1.2364 - 1.37e-3 * below20 + 5.7e-6 * below20 * below20);
  return VISCOSITY_AT_20C * Math.pow(10, exponent);
}

/**
 * Kinematic viscosity nu = mu / rho, m2/s, from the two correlations above.
 * Accepted 0-40 C.
 */
export function waterKinematicViscosity(temperature: number, field = '/temperature'): number {
  return waterDynamicViscosity(temperature, field) / waterDensity(temperature, field);
}

/** Critical temperature (K) and pressure (Pa) of water, IAPWS-95. */
const CRITICAL_TEMPERATURE = 647.096;
const CRITICAL_PRESSURE = 22.064e6;
const WAGNER_PRUSS = [-7.85951783, 1.84408259, -11.7866497, 22.6807411, -15.9618719, 1.80122502] as const;

/**
 * Saturation (vapour) pressure of water, Pa.
 *
 * Wagner-Pruss saturation equation with tau = 1 - T/Tc (T in K):
 *   ln(p/pc) = (Tc/T) (a1 tau + a2 tau^1.5 + a3 tau^3 + a4 tau^3.5 + a5 tau^4 + a6 tau^7.5)
 * Tc = 647.096 K, pc = 22.064 MPa. Source: W. Wagner, A. Pruss, "International
 * equations for the saturation properties of ordinary water substance",
 * J. Phys. Chem. Ref. Data 22(3), 783-787 (1993), as adopted in IAPWS-95.
 * Coefficients quoted from memory; the tests hold the result within 0.1 % of
 * IAPWS values at 10, 20 and 30 C. Valid from the triple point to the
 * critical point; accepted here 0-40 C.
 */
export function waterVapourPressure(temperature: number, field = '/temperature'): number {
  checkTemperature(temperature, field);
  const kelvin = temperature + 273.15;
  const tau = 1 - kelvin / CRITICAL_TEMPERATURE;
  const [a1, a2, a3, a4, a5, a6] = WAGNER_PRUSS;
  const series =
    a1 * tau +
    a2 * Math.pow(tau, 1.5) +
    a3 * Math.pow(tau, 3) +
    a4 * Math.pow(tau, 3.5) +
    a5 * Math.pow(tau, 4) +
    a6 * Math.pow(tau, 7.5);
  return CRITICAL_PRESSURE * Math.exp((CRITICAL_TEMPERATURE / kelvin) * series);
}

/** Density, kinematic viscosity and vapour pressure at one temperature. */
export interface WaterProperties {
  /** C */
  temperature: number;
  /** kg/m3 */
  density: number;
  /** m2/s */
  kinematicViscosity: number;
  /** Pa absolute */
  vapourPressure: number;
}

/** All three properties at `temperature` (C, 0-40). */
export function waterProperties(temperature: number, field = '/temperature'): WaterProperties {
  return {
    temperature,
    density: waterDensity(temperature, field),
    kinematicViscosity: waterKinematicViscosity(temperature, field),
    vapourPressure: waterVapourPressure(temperature, field),
  };
}
