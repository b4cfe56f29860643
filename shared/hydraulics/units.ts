import { unit } from 'mathjs';
import { HydraulicsInputError, requireFinite, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';

/*
 * Unit conversion at the edges of the engine. Everything inside works in SI
 * (m, m3/s, Pa). Conversion factors are built once from mathjs's unit
 * definitions at module load (US liquid gallon 3.785411784 L, international
 * foot 0.3048 m and inch 0.0254 m, psi from the avoirdupois pound-force, per
 * NIST SP 811, 2008 edition, Appendix B); conversions are then single
 * multiplications.
 */

/** Flow units accepted at the API edge. */
export const FLOW_UNITS = ['gpm', 'gph', 'L/min', 'L/s', 'm3/h', 'm3/s'] as const;
/** Head units accepted at the API edge. */
export const HEAD_UNITS = ['m', 'ft'] as const;
/** Pipe length units accepted at the API edge. */
export const LENGTH_UNITS = ['m', 'ft'] as const;
/** Pipe diameter units accepted at the API edge. */
export const DIAMETER_UNITS = ['mm', 'in', 'm'] as const;
/** Pressure units accepted at the API edge (gauge or absolute as the caller states). */
export const PRESSURE_UNITS = ['Pa', 'kPa', 'bar', 'psi'] as const;
/** Volume units (pond and tank volumes). */
export const VOLUME_UNITS = ['m3', 'L', 'gal'] as const;
/** Velocity units: a length unit per second. */
export const VELOCITY_UNITS = ['m/s', 'ft/s'] as const;
/** Power units accepted at the API edge and in curve tables (hp is mechanical horsepower, 745.699872 W). */
export const POWER_UNITS = ['W', 'kW', 'hp'] as const;

export type FlowUnit = (typeof FLOW_UNITS)[number];
export type HeadUnit = (typeof HEAD_UNITS)[number];
export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type DiameterUnit = (typeof DIAMETER_UNITS)[number];
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type PowerUnit = (typeof POWER_UNITS)[number];
export type VolumeUnit = (typeof VOLUME_UNITS)[number];
export type VelocityUnit = (typeof VELOCITY_UNITS)[number];

function factorsToSI<U extends string>(mathjsNames: Record<U, string>, siName: string): Readonly<Record<U, number>> {
  const factors = {} as Record<U, number>;
  for (const key of Object.keys(mathjsNames) as U[]) {
    factors[key] = unit(1, mathjsNames[key]).toNumber(siName);
  }
  return Object.freeze(factors);
}

const FLOW_FACTORS = factorsToSI<FlowUnit>(
  {
    gpm: 'gallon/minute',
    gph: 'gallon/hour',
    'L/min': 'liter/minute',
    'L/s': 'liter/second',
    'm3/h': 'm^3/hour',
    'm3/s': 'm^3/s',
  },
  'm^3/s',
);
const LENGTH_FACTORS = factorsToSI<LengthUnit>({ m: 'm', ft: 'ft' }, 'm');
const DIAMETER_FACTORS = factorsToSI<DiameterUnit>({ mm: 'mm', in: 'inch', m: 'm' }, 'm');
const PRESSURE_FACTORS = factorsToSI<PressureUnit>({ Pa: 'Pa', kPa: 'kPa', bar: 'bar', psi: 'psi' }, 'Pa');
const POWER_FACTORS = factorsToSI<PowerUnit>({ W: 'W', kW: 'kW', hp: 'hp' }, 'W');
const VOLUME_FACTORS = factorsToSI<VolumeUnit>({ m3: 'm^3', L: 'liter', gal: 'gallon' }, 'm^3');
const VELOCITY_FACTORS = factorsToSI<VelocityUnit>({ 'm/s': 'm/s', 'ft/s': 'ft/s' }, 'm/s');

/** A pair of conversions between `U` and the SI unit of one quantity. */
interface Conversion<U extends string> {
  toSI(value: number, unitName: U, field?: string): number;
  fromSI(value: number, unitName: U, field?: string): number;
  /** From one accepted unit straight to another, through SI. */
  between(value: number, from: U, to: U, field?: string): number;
}

function conversion<U extends string>(
  factors: Readonly<Record<U, number>>,
  accepted: readonly U[],
  quantity: string,
  defaultField: string,
): Conversion<U> {
  const factorFor = (unitName: string, field: string): number => {
    if (!Object.prototype.hasOwnProperty.call(factors, unitName)) {
      throw new HydraulicsInputError({
        code: 'unknown-unit',
        params: { quantity, value: unitName, accepted: [...accepted] },
        pointer: field,
      });
    }
    return factors[unitName as U];
  };
  const toSI = (value: number, unitName: U, field = defaultField) =>
    requireFinite(value, field, quantity) * factorFor(unitName, field);
  const fromSI = (value: number, unitName: U, field = defaultField) =>
    requireFinite(value, field, quantity) / factorFor(unitName, field);
  return {
    toSI,
    fromSI,
    between: (value, from, to, field = defaultField) => fromSI(toSI(value, from, field), to, field),
  };
}

const FLOW = conversion(FLOW_FACTORS, FLOW_UNITS, 'flow', '/flowUnit');
const HEAD = conversion(LENGTH_FACTORS, HEAD_UNITS, 'head', '/headUnit');
const LENGTH = conversion(LENGTH_FACTORS, LENGTH_UNITS, 'length', '/lengthUnit');
const DIAMETER = conversion(DIAMETER_FACTORS, DIAMETER_UNITS, 'diameter', '/diameterUnit');
const PRESSURE = conversion(PRESSURE_FACTORS, PRESSURE_UNITS, 'pressure', '/pressureUnit');
const POWER = conversion(POWER_FACTORS, POWER_UNITS, 'power', '/powerUnit');
const VOLUME = conversion(VOLUME_FACTORS, VOLUME_UNITS, 'volume', '/volumeUnit');
const VELOCITY = conversion(VELOCITY_FACTORS, VELOCITY_UNITS, 'velocity', '/velocityUnit');

/** Flow in `unitName` to m3/s. Unknown unit -> HydraulicsInputError listing FLOW_UNITS. */
export const flowToSI = FLOW.toSI;
/** Flow in m3/s to `unitName`. */
export const flowFromSI = FLOW.fromSI;
/** Flow from one unit to another, e.g. gpm to L/min. */
export const convertFlow = FLOW.between;
/** Head in `unitName` to m. */
export const headToSI = HEAD.toSI;
/** Head in m to `unitName`. */
export const headFromSI = HEAD.fromSI;
/** Head from one unit to another. */
export const convertHead = HEAD.between;
/** Pipe length in `unitName` to m. */
export const lengthToSI = LENGTH.toSI;
/** Pipe length in m to `unitName`. */
export const lengthFromSI = LENGTH.fromSI;
/** Pipe length from one unit to another. */
export const convertLength = LENGTH.between;
/** Diameter in `unitName` to m. */
export const diameterToSI = DIAMETER.toSI;
/** Diameter in m to `unitName`. */
export const diameterFromSI = DIAMETER.fromSI;
/** Diameter from one unit to another, e.g. mm to in. */
export const convertDiameter = DIAMETER.between;
/** Pressure in `unitName` to Pa. */
export const pressureToSI = PRESSURE.toSI;
/** Pressure in Pa to `unitName`. */
export const pressureFromSI = PRESSURE.fromSI;
/** Power in `unitName` to W. */
export const powerToSI = POWER.toSI;
/** Power in W to `unitName`. */
export const powerFromSI = POWER.fromSI;
/** Volume in `unitName` to m3. */
export const volumeToSI = VOLUME.toSI;
/** Volume in m3 to `unitName`. */
export const volumeFromSI = VOLUME.fromSI;
/** Velocity in `unitName` to m/s. */
export const velocityToSI = VELOCITY.toSI;
/** Velocity in m/s to `unitName`. */
export const velocityFromSI = VELOCITY.fromSI;

/**
 * Pressure to the equivalent column of water: h = p / (rho g).
 * @param value pressure in `unitName`
 * @param density water density, kg/m3 (see water-properties)
 * @returns head, m
 */
export function pressureToHead(
  value: number,
  unitName: PressureUnit,
  density: number,
  field = '/pressureUnit',
): number {
  requirePositive(density, '/density', 'density');
  return pressureToSI(value, unitName, field) / (density * STANDARD_GRAVITY);
}

/**
 * Head of water to pressure: p = rho g h.
 * @param head m
 * @param density kg/m3
 * @returns pressure in `unitName`
 */
export function headToPressure(head: number, unitName: PressureUnit, density: number, field = '/pressureUnit'): number {
  requirePositive(density, '/density', 'density');
  return pressureFromSI(requireFinite(head, '/head', 'head') * density * STANDARD_GRAVITY, unitName, field);
}
