import type { CalculationUnits, PowerUnit } from '../../shared/api/api-schemas';
import { diameterFromSI, flowFromSI, headFromSI, lengthFromSI, powerFromSI } from '../../shared/hydraulics';
import type { IssueValueText } from '../../shared/messages/engine-issue-text';

/* Units at the API edge, through the engine's conversions (shared/hydraulics/units.ts). */

export const defaultPowerUnit: PowerUnit = 'kW';

export function powerUnitOf(units: CalculationUnits): PowerUnit {
  return units.power ?? defaultPowerUnit;
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

/** How engine issues and refusals write their values for one request: its units, two decimals. */
export function requestValueText(units: CalculationUnits): IssueValueText {
  const to = answerUnits(units);
  return {
    flow: (value) => `${round(to.flow(value))} ${units.flow}`,
    velocity: (value) => `${round(to.length(value))} ${units.length}/s`,
    head: (value) => `${round(to.head(value))} ${units.head}`,
    power: (value) => `${round(to.power(value))} ${powerUnitOf(units)}`,
  };
}

/** Two decimals for messages; answers themselves carry full precision. */
export function round(value: number): number {
  return Math.round(value * 100) / 100;
}
