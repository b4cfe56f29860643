import { requireFinite, requireInRange, requireNonNegative, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import { polynomialValue } from './polynomial';
import { requireFlowInRange } from './pump-curve-evaluation';
import type { PumpCurveFit } from './pump-curve-fit';
import { volumeToSI } from './units';

/*
 * Power and energy. SI in: m3/s, m, kg/m3, W; energy out in kWh.
 */

/**
 * Hydraulic (water) power P_w = rho g Q H, W. The Hydraulic Institute's
 * customary form is water hp = Q(gpm) H(ft) SG / 3960 (ANSI/HI 1.6 / 14.6
 * definitions of pump power). Valid for any incompressible liquid. No checks (hot path).
 * @param flow - volumetric flow, m3/s
 * @param head - total dynamic head, m
 * @param density - liquid density, kg/m3
 * @returns water power, W
 * @example
 * // 100 gpm at 100 ft of water at 20 C (998.2 kg/m3, the 8.33 lb/gal behind the 3960, so SG 1):
 * // the customary form 100 x 100 / 3960 gives 2.525 hp, within the rounding of its constant
 * powerFromSI(hydraulicPower(flowToSI(100, 'gpm'), headToSI(100, 'ft'), 998.2), 'hp') // => 2.524
 * // exact: 1000 x 9.80665 x 0.01 x 10
 * hydraulicPower(0.01, 10, 1000) // => 980.665
 */
export function hydraulicPower(flow: number, head: number, density: number): number {
  return density * STANDARD_GRAVITY * flow * head;
}

export interface DriveEfficiencies {
  /** Motor efficiency 0-1 (default 1: the pump's figure already is electrical or no motor data). */
  motor?: number;
  /** Drive (variable-speed drive, belt) efficiency 0-1 (default 1). */
  drive?: number;
}

export interface PowerAtPoint {
  /** Water power rho g Q H, W. */
  hydraulic: number;
  /** Electrical input power, W; null when neither power nor efficiency is known. */
  electrical: number | null;
  /** Wire-to-water efficiency P_w / P_electrical; null when unknown. */
  wireToWaterEfficiency: number | null;
}

/**
 * Power at an operating point of a fitted pump.
 * Electrical input: from the fitted power curve when given (divided by motor
 * and drive efficiencies when that curve is shaft power), else
 * P_w / (eta_pump eta_motor eta_drive) from the fitted efficiency.
 * Source: ANSI/HI 1.6 / 14.6 power definitions; domain formulas
 * P_in = P_w / (eta_pump eta_motor eta_drive). Flow must be within the fit's range.
 * @param fit - a fitted curve (fitPumpCurve)
 * @param flow - volumetric flow, m3/s, within the fit's range
 * @param head - head at that flow, m
 * @param density - water density, kg/m3 (waterDensity)
 * @param efficiencies - motor and drive efficiencies, 0-1 (default 1 each)
 * @returns water power and electrical input power, W, and the wire-to-water efficiency, 0-1
 * @example
 * // invented curve with eta = 192 Q - 12800 Q^2: at 5 L/s and 8.75 m, eta 0.64; by hand
 * // P_w = 998.21 x 9.80665 x 0.005 x 8.75 = 428.27 W and P_in = 428.27 / (0.64 x 0.85) = 787.27 W
 * const fit = fitPumpCurve([{ flow: 0, head: 10, efficiency: 0 }, { flow: 0.005, head: 8.75, efficiency: 0.64 }, { flow: 0.01, head: 5, efficiency: 0.64 }])
 * const power = powerAtOperatingPoint(fit, 0.005, 8.75, 998.21, { motor: 0.85 })
 * power.hydraulic // => 428.27
 * power.electrical // => 787.27
 * power.wireToWaterEfficiency // => 0.544
 */
export function powerAtOperatingPoint(
  fit: PumpCurveFit,
  flow: number,
  head: number,
  density: number,
  efficiencies: DriveEfficiencies = {},
): PowerAtPoint {
  requireFlowInRange(fit, flow);
  requireFinite(head, '/head', 'head');
  requirePositive(density, '/density', 'density');
  const motor = requireInRange(efficiencies.motor ?? 1, 1e-3, 1, '/motorEfficiency', 'motor efficiency');
  const drive = requireInRange(efficiencies.drive ?? 1, 1e-3, 1, '/driveEfficiency', 'drive efficiency');
  const hydraulic = hydraulicPower(flow, head, density);
  const losses = fit.powerBasis === 'electrical' ? 1 : motor * drive;
  let electrical: number | null = null;
  if (fit.powerCoefficients) {
    electrical = polynomialValue(fit.powerCoefficients, flow) / losses;
  } else if (fit.efficiencyCoefficients) {
    const efficiency = polynomialValue(fit.efficiencyCoefficients, flow);
    electrical = efficiency > 0 ? hydraulic / (efficiency * losses) : null;
  }
  return {
    hydraulic,
    electrical,
    wireToWaterEfficiency: electrical && electrical > 0 ? hydraulic / electrical : null,
  };
}

/**
 * Motor efficiency assumed, 0-1, for a pump kind when the catalog gives none and the curve's power
 * is shaft power. Common practice, from memory, not a standard's table: the small single-phase
 * motors of pond submersibles run at some 60-80 % (sealed, oil- or water-filled, low rating);
 * a dry 0.5-1.5 kW motor of an external centrifugal pump about 75-80 % (IEC 60034-30-1 puts a
 * 0.75 kW four-pole IE2 motor near 80 %, single-phase capacitor motors below it); the 1.5-4 kW
 * three-phase motors of mixed-flow pumps about 80-85 % (IE2 to IE3 at that rating).
 * @example
 * DEFAULT_MOTOR_EFFICIENCY_BY_KIND.submersible // => 0.7
 * DEFAULT_MOTOR_EFFICIENCY_BY_KIND['external-centrifugal'] // => 0.75
 */
export const DEFAULT_MOTOR_EFFICIENCY_BY_KIND: Readonly<Record<string, number>> = {
  submersible: 0.7,
  'external-centrifugal': 0.75,
  'mixed-flow': 0.8,
};

/**
 * Days of running in the year the energy figures count: a common year (common practice).
 * @example
 * RUNNING_DAYS_PER_YEAR // => 365
 */
export const RUNNING_DAYS_PER_YEAR = 365;

/**
 * Annual energy, kWh, for `hoursPerDay` of running on RUNNING_DAYS_PER_YEAR days: E = P h 365 / 1000
 * (energy = power x time, the handbook's rule). No checks: the search ranks with it on its hot
 * path; annualEnergy is the checked form.
 * @param inputPower - electrical input power, W
 * @param hoursPerDay - hours of running per day
 * @returns energy per year, kWh
 * @example
 * // exact: 1000 W x 8 h x 365 d
 * annualEnergyUnchecked(1000, 8) // => 2920
 */
export function annualEnergyUnchecked(inputPower: number, hoursPerDay: number): number {
  return (inputPower * hoursPerDay * RUNNING_DAYS_PER_YEAR) / 1000;
}

/**
 * Annual energy, kWh, for `hoursPerDay` of running on 365 days: E = P h 365 / 1000 (energy =
 * power x time). Valid for 0-24 h a day and any power >= 0.
 * @param inputPower - electrical input power, W (>= 0)
 * @param hoursPerDay - hours of running per day (0-24)
 * @returns energy per year, kWh
 * @example
 * // exact: 250 W around the clock, 250 x 24 x 365 / 1000
 * annualEnergy(250, 24) // => 2190
 */
export function annualEnergy(inputPower: number, hoursPerDay: number): number {
  requireNonNegative(inputPower, '/inputPower', 'input power');
  requireInRange(hoursPerDay, 0, 24, '/hoursPerDay', 'hours per day');
  return annualEnergyUnchecked(inputPower, hoursPerDay);
}

/**
 * Energy cost = energy x tariff (the handbook's rule), in the tariff's currency.
 * @param kilowattHours - energy, kWh (>= 0)
 * @param tariff - price per kWh, any currency (>= 0)
 * @returns cost, in the tariff's currency
 * @example
 * // exact: 2920 kWh at 0.15 per kWh
 * energyCost(2920, 0.15) // => 438
 */
export function energyCost(kilowattHours: number, tariff: number): number {
  requireNonNegative(kilowattHours, '/energy', 'energy');
  requireNonNegative(tariff, '/tariff', 'tariff');
  return kilowattHours * tariff;
}

export interface SpecificEnergy {
  /** kWh per m3 pumped. */
  perCubicMetre: number;
  /** kWh per 1000 US gallons pumped. */
  perThousandUsGallons: number;
}

/**
 * Specific energy E/V = P / Q: kWh per m3 (P / (Q x 3.6e6)) and per 1000 US gal (3.785411784 m3,
 * NIST SP 811 (2008), Appendix B).
 * @param inputPower - electrical input power, W (>= 0)
 * @param flow - volumetric flow, m3/s (> 0)
 * @returns energy per volume pumped, kWh/m3 and kWh per 1000 US gal
 * @example
 * // by hand: 1000 W / (0.01 m3/s x 3.6e6 J/kWh) = 0.027778 kWh/m3, x 3.785411784 = 0.10515
 * specificEnergy(1000, 0.01).perCubicMetre // => 0.027778
 * specificEnergy(1000, 0.01).perThousandUsGallons // => 0.10515
 */
export function specificEnergy(inputPower: number, flow: number): SpecificEnergy {
  requireNonNegative(inputPower, '/inputPower', 'input power');
  requirePositive(flow, '/flow', 'flow');
  const perCubicMetre = inputPower / (flow * 3.6e6);
  return { perCubicMetre, perThousandUsGallons: perCubicMetre * volumeToSI(1000, 'gal') };
}
