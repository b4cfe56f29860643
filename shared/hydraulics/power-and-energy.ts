import { requireFinite, requireInRange, requireNonNegative, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';
import { polynomialValue } from './polynomial';
import { type PumpCurveFit, requireFlowInRange } from './pump-curve-fit';

/*
 * Power and energy. SI in: m3/s, m, kg/m3, W; energy out in kWh.
 */

/** m3 in one US gallon (exact, NIST SP 811). */
const CUBIC_METRES_PER_US_GALLON = 3.785411784e-3;

/**
 * Hydraulic (water) power P_w = rho g Q H, W. The Hydraulic Institute's
 * customary form is water hp = Q(gpm) H(ft) SG / 3960 (ANSI/HI 1.6 / 14.6
 * definitions of pump power). Valid for any incompressible liquid.
 * @param flow m3/s  @param head m  @param density kg/m3
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

/** Days of running in the year the energy figures count: a common year (common practice). */
export const RUNNING_DAYS_PER_YEAR = 365;

/**
 * Annual energy, kWh, for `hoursPerDay` of running on RUNNING_DAYS_PER_YEAR days: E = P h 365 / 1000.
 * No checks: the search ranks with it on its hot path; annualEnergy is the checked form.
 */
export function annualEnergyUnchecked(inputPower: number, hoursPerDay: number): number {
  return (inputPower * hoursPerDay * RUNNING_DAYS_PER_YEAR) / 1000;
}

/** Annual energy, kWh, for `hoursPerDay` of running on 365 days: E = P h 365 / 1000. */
export function annualEnergy(inputPower: number, hoursPerDay: number): number {
  requireNonNegative(inputPower, '/inputPower', 'input power');
  requireInRange(hoursPerDay, 0, 24, '/hoursPerDay', 'hours per day');
  return annualEnergyUnchecked(inputPower, hoursPerDay);
}

/** Energy cost for `kilowattHours` at `tariff` (currency per kWh). */
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

/** Specific energy E/V = P / Q: kWh per m3 and per 1000 US gal. @param inputPower W @param flow m3/s */
export function specificEnergy(inputPower: number, flow: number): SpecificEnergy {
  requireNonNegative(inputPower, '/inputPower', 'input power');
  requirePositive(flow, '/flow', 'flow');
  const perCubicMetre = inputPower / (flow * 3.6e6);
  return { perCubicMetre, perThousandUsGallons: perCubicMetre * 1000 * CUBIC_METRES_PER_US_GALLON };
}
