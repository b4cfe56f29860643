import { unit } from 'mathjs';
import type { CalculationUnits, PowerUnit } from '../../shared/api/api-schemas';
import { diameterFromSI, flowFromSI, headFromSI, lengthFromSI } from '../../shared/hydraulics';

/*
 * Units at the API edge. Flow, head, length and diameter use the engine's conversions
 * (shared/hydraulics/units.ts); power, which the engine keeps in W, is converted here with the
 * same mathjs definitions (mechanical horsepower 745.699872 W, NIST SP 811, 2008, Appendix B.8).
 */

const WATTS_PER: Readonly<Record<PowerUnit, number>> = Object.freeze({
  W: 1,
  kW: 1000,
  hp: unit(1, 'hp').toNumber('W'),
});

export const defaultPowerUnit: PowerUnit = 'kW';

export function powerUnitOf(units: CalculationUnits): PowerUnit {
  return units.power ?? defaultPowerUnit;
}

export function powerToSI(value: number, unitName: PowerUnit): number {
  return value * WATTS_PER[unitName];
}

export function powerFromSI(watts: number, unitName: PowerUnit): number {
  return watts / WATTS_PER[unitName];
}

/** The request's units with the defaults it left out filled in, as every answer echoes them. */
export function echoedUnits(units: CalculationUnits): CalculationUnits {
  return { ...units, power: powerUnitOf(units) };
}

/** Conversions from SI into one request's units. */
export interface AnswerUnits {
  flow: (flow: number) => number;
  head: (head: number) => number;
  length: (length: number) => number;
  diameter: (diameter: number) => number;
  power: (watts: number) => number;
}

export function answerUnits(units: CalculationUnits): AnswerUnits {
  const power = powerUnitOf(units);
  return {
    flow: (value) => flowFromSI(value, units.flow),
    head: (value) => headFromSI(value, units.head),
    length: (value) => lengthFromSI(value, units.length),
    diameter: (value) => diameterFromSI(value, units.diameter),
    power: (value) => powerFromSI(value, power),
  };
}
