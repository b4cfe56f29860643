import {
  diameterFromSI,
  diameterToSI,
  flowFromSI,
  flowToSI,
  headFromSI,
  headToSI,
  lengthFromSI,
  lengthToSI,
  type DiameterUnit,
  type FlowUnit,
  type HeadUnit,
  type LengthUnit,
} from './units';

/*
 * Riffle's own plausibility limits, SI: the contract accepts any positive number, but a 40 km
 * pipe or a 1 mm bore in a water feature is a typing slip (a unit mix-up, a lost decimal point),
 * so it is refused with the field named instead of computed. One table for the API and the
 * client's forms, so both refuse the same inputs; limits are inclusive (the limit itself passes).
 */

/** Which unit a limited input is typed in; a coefficient has none. */
export type PlausibleQuantity = 'head' | 'length' | 'diameter' | 'flow' | 'coefficient';

export interface PlausibleLimit {
  /** The input as a message names it. */
  label: string;
  quantity: PlausibleQuantity;
  /** Lowest plausible value, SI; null where the engine's own checks are the floor. */
  min: number | null;
  /** Highest plausible value, SI. */
  max: number;
  /** What the limit stands for. */
  meaning: string;
}

const MOST_FLOW = 10;

/**
 * Riffle's plausibility limits by input, SI (our own judgement of what a water feature can need,
 * each `meaning` saying why; not from a standard).
 * @example
 * PLAUSIBLE_LIMITS.segmentLength.max // => 20000
 * PLAUSIBLE_LIMITS.insideDiameter.min // => 0.003
 */
export const PLAUSIBLE_LIMITS = Object.freeze({
  staticHead: {
    label: 'static head',
    quantity: 'head',
    min: -500,
    max: 500,
    meaning: 'lift (or fall) from the intake level to the discharge level, m: 500 m is beyond any water feature',
  },
  outletPressureHead: {
    label: 'outlet pressure head',
    quantity: 'head',
    min: 0,
    max: 500,
    meaning: 'pressure wanted at the outlet as head of water, m',
  },
  segmentLength: {
    label: 'segment length',
    quantity: 'length',
    min: 0,
    max: 20_000,
    meaning: 'length of one pipe segment, m: 20 km is no water feature',
  },
  insideDiameter: {
    label: 'inside diameter',
    quantity: 'diameter',
    min: 0.003,
    max: 2,
    meaning: 'bore of a pipe, m: 3 mm to 2 m',
  },
  roughness: {
    label: 'roughness',
    quantity: 'diameter',
    min: 0,
    max: 0.01,
    meaning: 'absolute roughness of a pipe wall, m: 10 mm is beyond corroded cast iron',
  },
  extraK: {
    label: 'extra loss coefficient K',
    quantity: 'coefficient',
    min: 0,
    max: 10_000,
    meaning:
      'extra resistance of one segment (filter module, manifold, nozzle): 10,000 is a closed valve, not a water feature',
  },
  flow: {
    label: 'flow',
    quantity: 'flow',
    min: 0,
    max: MOST_FLOW,
    meaning: 'a flow asked for (system curve, duty band), m3/s',
  },
  pumpCurveFlow: {
    label: 'flow',
    quantity: 'flow',
    min: null,
    max: MOST_FLOW,
    meaning: 'a flow of a published pump curve point, m3/s (its sign is the curve fit’s check)',
  },
  pumpCurveHead: {
    label: 'head',
    quantity: 'head',
    min: null,
    max: 1000,
    meaning: 'a head of a published pump curve point, m: beyond any water-feature pump',
  },
} satisfies Record<string, PlausibleLimit>);

export type PlausibleLimitName = keyof typeof PLAUSIBLE_LIMITS;

/** A value outside its plausible range: a code and its parameters, for a message in any units. */
export interface PlausibilityViolation {
  code: 'above-plausible-max' | 'below-plausible-min';
  limit: PlausibleLimitName;
  /** The limit passed, SI. */
  bound: number;
}

/**
 * Null when `value` (SI) lies inside the named limit (inclusive), else what it breaks.
 * @param limit - a name of PLAUSIBLE_LIMITS
 * @param value - the input, SI (m, m3/s)
 * @returns null, or the violation: code, limit name and the SI bound passed
 * @example
 * checkPlausible('segmentLength', 40000).bound // => 20000
 * checkPlausible('segmentLength', 20000) // => null
 */
export function checkPlausible(limit: PlausibleLimitName, value: number): PlausibilityViolation | null {
  const { min, max } = PLAUSIBLE_LIMITS[limit] as PlausibleLimit;
  if (value > max) return { code: 'above-plausible-max', limit, bound: max };
  if (min !== null && value < min) return { code: 'below-plausible-min', limit, bound: min };
  return null;
}

/** The units a message states limits in. */
export interface PlausibleUnits {
  flow: FlowUnit;
  head: HeadUnit;
  length: LengthUnit;
  diameter: DiameterUnit;
}

/**
 * SI throughout, for a message where the request names no units.
 * @example
 * SI_PLAUSIBLE_UNITS.flow // => 'm3/s'
 */
export const SI_PLAUSIBLE_UNITS: PlausibleUnits = Object.freeze({
  flow: 'm3/s',
  head: 'm',
  length: 'm',
  diameter: 'm',
});

/** The engine's conversions for each quantity, with the unit of `units` it takes. */
const CONVERSIONS = {
  head: { toSI: headToSI, fromSI: headFromSI },
  length: { toSI: lengthToSI, fromSI: lengthFromSI },
  diameter: { toSI: diameterToSI, fromSI: diameterFromSI },
  flow: { toSI: flowToSI, fromSI: flowFromSI },
} as const;

type UnitName = PlausibleUnits[keyof typeof CONVERSIONS];

/** The unit a message states a quantity in; none for a coefficient. */
function unitText(quantity: PlausibleQuantity, units: PlausibleUnits): string {
  return quantity === 'coefficient' ? '' : ` ${units[quantity]}`;
}

/**
 * A limit (SI) in the user's units, by the engine's conversions (units.ts).
 * @param quantity - which kind of input: 'head', 'length', 'diameter', 'flow' or 'coefficient' (no unit)
 * @param value - the limit, SI
 * @param units - the user's unit for each quantity
 * @returns the limit in the user's unit for that quantity
 * @example
 * // 500 m is 1640.42 ft (exact foot 0.3048 m)
 * limitInUnits('head', 500, { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }) // => 1640.42
 */
export function limitInUnits(quantity: PlausibleQuantity, value: number, units: PlausibleUnits): number {
  if (quantity === 'coefficient') return value;
  return (CONVERSIONS[quantity].fromSI as (value: number, unit: UnitName) => number)(value, units[quantity]);
}

/**
 * A value typed in the user's units, in SI, by the engine's conversions (units.ts).
 * @param quantity - which kind of input: 'head', 'length', 'diameter', 'flow' or 'coefficient' (no unit)
 * @param value - the value in the user's unit for that quantity
 * @param units - the user's unit for each quantity
 * @returns the value, SI
 * @example
 * // exact: 2 in = 0.0508 m
 * valueToSI('diameter', 2, { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }) // => 0.0508
 */
export function valueToSI(quantity: PlausibleQuantity, value: number, units: PlausibleUnits): number {
  if (quantity === 'coefficient') return value;
  return (CONVERSIONS[quantity].toSI as (value: number, unit: UnitName) => number)(value, units[quantity]);
}

/**
 * checkPlausible for a value typed in the user's units, as a form holds it.
 * @param limit - a name of PLAUSIBLE_LIMITS
 * @param value - the value in the user's unit for the limit's quantity
 * @param units - the user's unit for each quantity
 * @returns null, or the violation with its SI bound
 * @example
 * // 2000 ft is 609.6 m, above the 500 m limit of static head
 * checkPlausibleInUnits('staticHead', 2000, { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }).code // => 'above-plausible-max'
 */
export function checkPlausibleInUnits(
  limit: PlausibleLimitName,
  value: number,
  units: PlausibleUnits,
): PlausibilityViolation | null {
  return checkPlausible(limit, valueToSI(PLAUSIBLE_LIMITS[limit].quantity, value, units));
}

/**
 * Four significant figures, rounded toward the inside of the range, so the figure a message
 * states is itself accepted.
 */
function stated(value: number, inward: 'down' | 'up'): number {
  if (value === 0) return 0;
  const step = 10 ** (Math.floor(Math.log10(Math.abs(value))) - 3);
  return (inward === 'down' ? Math.floor(value / step) : Math.ceil(value / step)) * step;
}

/**
 * "static head must be at most 1640 ft": the violation stated in the user's units, the figure
 * rounded to four significant figures toward the inside of the range so that it is itself accepted.
 * @param violation - what checkPlausible returned
 * @param units - the user's unit for each quantity
 * @returns the sentence
 * @example
 * const units = { flow: 'gpm', head: 'ft', length: 'ft', diameter: 'in' }
 * plausibilityMessage(checkPlausible('staticHead', 600), units) // => 'static head must be at most 1640 ft'
 * plausibilityMessage(checkPlausible('extraK', 2e4), units) // => 'extra loss coefficient K must be at most 10000'
 */
export function plausibilityMessage(violation: PlausibilityViolation, units: PlausibleUnits): string {
  const { label, quantity } = PLAUSIBLE_LIMITS[violation.limit];
  const above = violation.code === 'above-plausible-max';
  const figure = Number(stated(limitInUnits(quantity, violation.bound, units), above ? 'down' : 'up').toPrecision(4));
  return `${label} must be at ${above ? 'most' : 'least'} ${figure}${unitText(quantity, units)}`;
}
