import { requireInRange } from './hydraulics-error';

/*
 * Properties of liquid water at atmospheric pressure, 0-40 C, the range of
 * outdoor water features, by the IAPWS formulations (density IF97, viscosity
 * 2008, saturation pressure SR1-86). The tests check each against Debian's
 * python3-iapws at test time.
 */

/** Lowest water temperature the engine accepts, C: the freezing point at 101.325 kPa. */
export const WATER_TEMPERATURE_MIN = 0;
/**
 * Highest water temperature the engine accepts, C: the top of the range of outdoor water features
 * and of the checks against python3-iapws (the formulations themselves hold far beyond it).
 */
export const WATER_TEMPERATURE_MAX = 40;

function checkTemperature(temperature: number, field: string): void {
  requireInRange(temperature, WATER_TEMPERATURE_MIN, WATER_TEMPERATURE_MAX, field, 'water temperature (C)');
}

/** Offset of the Celsius scale from the kelvin, K (ITS-90). */
const KELVIN_AT_0C = 273.15;
/** Standard atmosphere, Pa: the pressure at which the engine takes its water. */
const ATMOSPHERE = 101325;
/** Specific gas constant of water, J/(kg K), IAPWS R7-97(2012) eq. (1). */
const WATER_GAS_CONSTANT = 461.526;

/** Exponents I_i, J_i and coefficients n_i of the region 1 Gibbs free energy, IAPWS R7-97(2012) Table 2. */
const REGION_1_I = [
  0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32,
];
/** Exponents J_i of the region 1 Gibbs free energy, IAPWS R7-97(2012) Table 2 (in the order of REGION_1_I). */
const REGION_1_J = [
  -2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39,
  -40, -41,
];
/** Coefficients n_i of the region 1 Gibbs free energy, IAPWS R7-97(2012) Table 2 (in the order of REGION_1_I). */
const REGION_1_N = [
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872, 0.15772038513228,
  -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1,
  -0.32529748770505e-1, -0.21841717175414e-1, -0.5283835796993e-4, -0.47184321073267e-3, -0.30001780793026e-3,
  0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4, -0.28270797985312e-5,
  -0.85205128120103e-9, -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12, -0.40516996860117e-6,
  -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22,
  -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
];

/**
 * Specific volume of liquid water in IAPWS-IF97 region 1, m3/kg, from the pressure derivative of
 * the dimensionless Gibbs free energy: v = (R T / p) pi gamma_pi with pi = p / 16.53 MPa,
 * tau = 1386 K / T and gamma_pi = sum -n_i I_i (7.1 - pi)^(I_i - 1) (tau - 1.222)^J_i.
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam, section 5 (eq. 7, Tables 2 and 3).
 */
function specificVolumeRegion1(kelvin: number, pressure: number): number {
  const pi = pressure / 16.53e6;
  const tau = 1386 / kelvin;
  let gammaPi = 0;
  for (let term = 0; term < REGION_1_N.length; term += 1) {
    const i = REGION_1_I[term];
    gammaPi -= REGION_1_N[term] * i * Math.pow(7.1 - pi, i - 1) * Math.pow(tau - 1.222, REGION_1_J[term]);
  }
  return ((WATER_GAS_CONSTANT * kelvin) / pressure) * pi * gammaPi;
}

/**
 * Density of water at 101.325 kPa, kg/m3: 1 / v of IAPWS-IF97 region 1 (see specificVolumeRegion1;
 * IAPWS R7-97(2012), section 5, eq. 7 and Table 3). IF97 reproduces the scientific formulation
 * IAPWS-95 to within 0.01 kg/m3 over 0-40 C at this pressure (the tests compare it with
 * python3-iapws). Valid 0-40 C here (region 1 itself covers 273.15-623.15 K).
 * @param temperature - water temperature, C (0-40)
 * @param field - JSON pointer named when the temperature is rejected
 * @returns density, kg/m3
 * @example
 * // IAPWS-95 via python3-iapws: 998.21 kg/m3 at 20 C, 999.70 at 10 C (the handbook's table)
 * waterDensity(20) // => 998.206
 * waterDensity(10) // => 999.70
 */
export function waterDensity(temperature: number, field = '/temperature'): number {
  checkTemperature(temperature, field);
  return 1 / specificVolumeRegion1(temperature + KELVIN_AT_0C, ATMOSPHERE);
}

/** Critical temperature (K) and density (kg/m3) of water, IAPWS R12-08 eq. (3)-(5), as in IAPWS-95. */
const VISCOSITY_CRITICAL_TEMPERATURE = 647.096;
const VISCOSITY_CRITICAL_DENSITY = 322;
/** Reference viscosity, Pa s, IAPWS R12-08 eq. (6). */
const REFERENCE_VISCOSITY = 1e-6;
/** Coefficients H_i of the dilute-gas viscosity, IAPWS R12-08 Table 1. */
const DILUTE_GAS_H = [1.67752, 2.20462, 0.6366564, -0.241605];
/** Exponents i, j and coefficients H_ij of the residual viscosity, IAPWS R12-08 Table 2. */
const RESIDUAL_I = [0, 1, 2, 3, 0, 1, 2, 3, 5, 0, 1, 2, 3, 4, 0, 1, 0, 3, 4, 3, 5];
const RESIDUAL_J = [0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 4, 4, 5, 6, 6];
const RESIDUAL_H = [
  0.520094, 0.850895e-1, -0.108374e1, -0.289555, 0.222531, 0.999115, 0.188797e1, 0.126613e1, 0.120573, -0.281378,
  -0.906851, -0.772479, -0.489837, -0.25704, 0.161913, 0.257399, -0.325372e-1, 0.698452e-1, 0.872102e-2, -0.435673e-2,
  -0.593264e-3,
];

/**
 * Dynamic viscosity of water at 101.325 kPa, Pa s, by the IAPWS 2008 formulation for industrial
 * use: mu = mu* mu0(T) mu1(T, rho), the critical enhancement mu2 taken as 1 (it differs from 1
 * only near the critical point), with
 *   mu0 = 100 sqrt(Tr) / sum_i H_i / Tr^i,
 *   mu1 = exp(rho_r sum_ij H_ij (1/Tr - 1)^i (rho_r - 1)^j),
 * Tr = T / 647.096 K, rho_r = rho / 322 kg/m3, rho from waterDensity. Source: IAPWS R12-08,
 * Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water Substance,
 * eq. (10)-(12), Tables 1 and 2. Valid 0-40 C here (the release covers the whole liquid range).
 * @param temperature - water temperature, C (0-40)
 * @param field - JSON pointer named when the temperature is rejected
 * @returns dynamic viscosity, Pa s
 * @example
 * // IAPWS 2008 via python3-iapws: 1.0016 mPa s at 20 C, 1.3059 at 10 C (the handbook's table)
 * waterDynamicViscosity(20) // => 1.00160e-3
 * waterDynamicViscosity(10) // => 1.3059e-3
 */
export function waterDynamicViscosity(temperature: number, field = '/temperature'): number {
  const density = waterDensity(temperature, field);
  const reducedTemperature = (temperature + KELVIN_AT_0C) / VISCOSITY_CRITICAL_TEMPERATURE;
  const reducedDensity = density / VISCOSITY_CRITICAL_DENSITY;
  const diluteSum = DILUTE_GAS_H.reduce((sum, h, i) => sum + h / Math.pow(reducedTemperature, i), 0);
  const diluteGas = (100 * Math.sqrt(reducedTemperature)) / diluteSum;
  let residualSum = 0;
  for (let term = 0; term < RESIDUAL_H.length; term += 1) {
    residualSum +=
      RESIDUAL_H[term] *
      Math.pow(1 / reducedTemperature - 1, RESIDUAL_I[term]) *
      Math.pow(reducedDensity - 1, RESIDUAL_J[term]);
  }
  return REFERENCE_VISCOSITY * diluteGas * Math.exp(reducedDensity * residualSum);
}

/**
 * Kinematic viscosity nu = mu / rho, m2/s, from waterDynamicViscosity and waterDensity
 * (IAPWS R12-08 and R7-97(2012)). Valid 0-40 C.
 * @param temperature - water temperature, C (0-40)
 * @param field - JSON pointer named when the temperature is rejected
 * @returns kinematic viscosity, m2/s
 * @example
 * waterKinematicViscosity(20) // => 1.00340e-6
 */
export function waterKinematicViscosity(temperature: number, field = '/temperature'): number {
  return waterDynamicViscosity(temperature, field) / waterDensity(temperature, field);
}

/**
 * Critical temperature (K) and pressure (Pa) of water, the constants T_c and p_c stated with
 * eq. (1) of IAPWS SR1-86(1992) (the values of IAPWS-95).
 */
const CRITICAL_TEMPERATURE = VISCOSITY_CRITICAL_TEMPERATURE;
const CRITICAL_PRESSURE = 22.064e6;
/** Coefficients a1-a6 of the saturation-pressure equation, as stated with eq. (1) of IAPWS SR1-86(1992). */
const WAGNER_PRUSS = [-7.85951783, 1.84408259, -11.7866497, 22.6807411, -15.9618719, 1.80122502] as const;

/**
 * Saturation (vapour) pressure of water, Pa.
 *
 * Wagner-Pruss saturation equation with tau = 1 - T/Tc (T in K):
 *   ln(p/pc) = (Tc/T) (a1 tau + a2 tau^1.5 + a3 tau^3 + a4 tau^3.5 + a5 tau^4 + a6 tau^7.5)
 * Tc = 647.096 K, pc = 22.064 MPa. Source: W. Wagner, A. Pruss, "International
 * equations for the saturation properties of ordinary water substance",
 * J. Phys. Chem. Ref. Data 22(3), 783-787 (1993), adopted as eq. (1) of IAPWS
 * SR1-86(1992), Revised Supplementary Release on Saturation Properties of Ordinary
 * Water Substance; the tests compare it with IAPWS-95 saturation from python3-iapws.
 * Valid from the triple point to the critical point; accepted here 0-40 C.
 * @param temperature - water temperature, C (0-40)
 * @param field - JSON pointer named when the temperature is rejected
 * @returns saturation pressure, Pa absolute
 * @example
 * // IAPWS-95 saturation via python3-iapws: 2.339 kPa at 20 C, 4.247 kPa at 30 C (the handbook's table)
 * waterVapourPressure(20) // => 2339.2
 * waterVapourPressure(30) // => 4247
 */
export function waterVapourPressure(temperature: number, field = '/temperature'): number {
  checkTemperature(temperature, field);
  const kelvin = temperature + KELVIN_AT_0C;
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

/**
 * Density, kinematic viscosity and vapour pressure at one temperature, from waterDensity,
 * waterKinematicViscosity and waterVapourPressure (IAPWS R7-97(2012), R12-08, SR1-86(1992)).
 * @param temperature - water temperature, C (0-40)
 * @param field - JSON pointer named when the temperature is rejected
 * @returns the three properties in SI (kg/m3, m2/s, Pa absolute) with the temperature
 * @example
 * const water = waterProperties(20)
 * // python3-iapws at 20 C: 998.21 kg/m3, 2.339 kPa
 * water.density // => 998.21
 * water.kinematicViscosity // => 1.0034e-6
 * water.vapourPressure // => 2339
 */
export function waterProperties(temperature: number, field = '/temperature'): WaterProperties {
  return {
    temperature,
    density: waterDensity(temperature, field),
    kinematicViscosity: waterKinematicViscosity(temperature, field),
    vapourPressure: waterVapourPressure(temperature, field),
  };
}
