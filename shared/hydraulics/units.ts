import { HydraulicsInputError, requireFinite, requirePositive } from './hydraulics-error';
import { STANDARD_GRAVITY } from './physical-constants';

/*
 * Unit conversion at the edges of the engine. Everything inside works in SI
 * (m, m3/s, Pa). The factors follow from the exact definitions of NIST SP 811,
 * 2008 edition, Appendix B (international foot 0.3048 m and inch 0.0254 m, US
 * liquid gallon 231 in3, avoirdupois pound 0.45359237 kg with standard gravity
 * for the pound-force, mechanical horsepower 550 ft lbf/s), so conversions are
 * single multiplications. test/shared/units.test.ts checks every factor against
 * mathjs's unit definitions; the factors are spelt here rather than built with
 * mathjs at load so that the design pages do not download mathjs for them.
 */

/** Flow units accepted at the API edge. */
export const FLOW_UNITS = ['gpm', 'gph', 'L/h', 'L/min', 'L/s', 'm3/h', 'm3/s'] as const;
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

const INCH = 0.0254;
const FOOT = 0.3048;
const LITRE = 1e-3;
const US_GALLON = 231 * INCH ** 3;
const POUND_FORCE = 0.45359237 * STANDARD_GRAVITY;
const MINUTE = 60;
const HOUR = 3600;

/** Each unit's size in SI (m3/s, m, Pa, W, m3, m/s), from the definitions above. */
export const UNIT_FACTORS_TO_SI = Object.freeze({
  flow: Object.freeze<Record<FlowUnit, number>>({
    gpm: US_GALLON / MINUTE,
    gph: US_GALLON / HOUR,
    'L/h': LITRE / HOUR,
    'L/min': LITRE / MINUTE,
    'L/s': LITRE,
    'm3/h': 1 / HOUR,
    'm3/s': 1,
  }),
  length: Object.freeze<Record<LengthUnit, number>>({ m: 1, ft: FOOT }),
  diameter: Object.freeze<Record<DiameterUnit, number>>({ mm: 1e-3, in: INCH, m: 1 }),
  pressure: Object.freeze<Record<PressureUnit, number>>({ Pa: 1, kPa: 1e3, bar: 1e5, psi: POUND_FORCE / INCH ** 2 }),
  power: Object.freeze<Record<PowerUnit, number>>({ W: 1, kW: 1e3, hp: 550 * FOOT * POUND_FORCE }),
  volume: Object.freeze<Record<VolumeUnit, number>>({ m3: 1, L: LITRE, gal: US_GALLON }),
  velocity: Object.freeze<Record<VelocityUnit, number>>({ 'm/s': 1, 'ft/s': FOOT }),
});

const FLOW_FACTORS = UNIT_FACTORS_TO_SI.flow;
const LENGTH_FACTORS = UNIT_FACTORS_TO_SI.length;
const DIAMETER_FACTORS = UNIT_FACTORS_TO_SI.diameter;
const PRESSURE_FACTORS = UNIT_FACTORS_TO_SI.pressure;
const POWER_FACTORS = UNIT_FACTORS_TO_SI.power;
const VOLUME_FACTORS = UNIT_FACTORS_TO_SI.volume;
const VELOCITY_FACTORS = UNIT_FACTORS_TO_SI.velocity;

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

/**
 * Flow in `unitName` to m3/s: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - flow in `unitName`
 * @param unitName - one of FLOW_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns flow, m3/s
 * @example
 * // exact: 100 x 3.785411784 L / 60 s
 * flowToSI(100, 'gpm') // => 6.30901964e-3
 */
export const flowToSI = FLOW.toSI;
/**
 * Flow in m3/s to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - flow, m3/s
 * @param unitName - one of FLOW_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns flow in `unitName`
 * @example
 * // exact
 * flowFromSI(0.001, 'L/min') // => 60
 */
export const flowFromSI = FLOW.fromSI;
/**
 * Flow from one accepted unit to another, through m3/s (NIST SP 811 (2008), App. B).
 * @param value - flow in `from`
 * @param from - one of FLOW_UNITS
 * @param to - one of FLOW_UNITS
 * @param field - JSON pointer named when the value or a unit is rejected
 * @returns flow in `to`
 * @example
 * // exact: the trade's 1 gpm = 60 gph
 * convertFlow(1, 'gpm', 'gph') // => 60
 */
export const convertFlow = FLOW.between;
/**
 * Head in `unitName` to m: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - head in `unitName`
 * @param unitName - one of HEAD_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns head, m
 * @example
 * // exact: international foot 0.3048 m
 * headToSI(100, 'ft') // => 30.48
 */
export const headToSI = HEAD.toSI;
/**
 * Head in m to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - head, m
 * @param unitName - one of HEAD_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns head in `unitName`
 * @example
 * // exact
 * headFromSI(30.48, 'ft') // => 100
 */
export const headFromSI = HEAD.fromSI;
/**
 * Head from one accepted unit to another, through m (NIST SP 811 (2008), App. B).
 * @param value - head in `from`
 * @param from - one of HEAD_UNITS
 * @param to - one of HEAD_UNITS
 * @param field - JSON pointer named when the value or a unit is rejected
 * @returns head in `to`
 * @example
 * // by hand: 10 / 0.3048
 * convertHead(10, 'm', 'ft') // => 32.8084
 */
export const convertHead = HEAD.between;
/**
 * Pipe length in `unitName` to m: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - pipe length in `unitName`
 * @param unitName - one of LENGTH_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns pipe length, m
 * @example
 * // exact
 * lengthToSI(250, 'ft') // => 76.2
 */
export const lengthToSI = LENGTH.toSI;
/**
 * Pipe length in m to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - pipe length, m
 * @param unitName - one of LENGTH_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns pipe length in `unitName`
 * @example
 * // exact
 * lengthFromSI(76.2, 'ft') // => 250
 */
export const lengthFromSI = LENGTH.fromSI;
/**
 * Pipe length from one accepted unit to another, through m (NIST SP 811 (2008), App. B).
 * @param value - pipe length in `from`
 * @param from - one of LENGTH_UNITS
 * @param to - one of LENGTH_UNITS
 * @param field - JSON pointer named when the value or a unit is rejected
 * @returns pipe length in `to`
 * @example
 * // exact
 * convertLength(100, 'ft', 'm') // => 30.48
 */
export const convertLength = LENGTH.between;
/**
 * Diameter in `unitName` to m: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - diameter in `unitName`
 * @param unitName - one of DIAMETER_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns diameter, m
 * @example
 * // exact: inch 25.4 mm; the bore of 3" Schedule 40
 * diameterToSI(3.068, 'in') // => 0.0779272
 */
export const diameterToSI = DIAMETER.toSI;
/**
 * Diameter in m to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - diameter, m
 * @param unitName - one of DIAMETER_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns diameter in `unitName`
 * @example
 * // exact
 * diameterFromSI(0.05, 'mm') // => 50
 */
export const diameterFromSI = DIAMETER.fromSI;
/**
 * Diameter from one accepted unit to another, through m (NIST SP 811 (2008), App. B).
 * @param value - diameter in `from`
 * @param from - one of DIAMETER_UNITS
 * @param to - one of DIAMETER_UNITS
 * @param field - JSON pointer named when the value or a unit is rejected
 * @returns diameter in `to`
 * @example
 * // exact
 * convertDiameter(2, 'in', 'mm') // => 50.8
 */
export const convertDiameter = DIAMETER.between;
/**
 * Pressure in `unitName` to Pa: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - pressure in `unitName`
 * @param unitName - one of PRESSURE_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns pressure, Pa
 * @example
 * // NIST SP 811 gives 1 psi = 6.894757 kPa
 * pressureToSI(1, 'psi') // => 6894.757
 */
export const pressureToSI = PRESSURE.toSI;
/**
 * Pressure in Pa to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - pressure, Pa
 * @param unitName - one of PRESSURE_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns pressure in `unitName`
 * @example
 * // exact: bar 1e5 Pa
 * pressureFromSI(250000, 'bar') // => 2.5
 */
export const pressureFromSI = PRESSURE.fromSI;
/**
 * Power in `unitName` to W: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - power in `unitName`
 * @param unitName - one of POWER_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns power, W
 * @example
 * // NIST SP 811: mechanical horsepower 745.6999 W
 * powerToSI(1, 'hp') // => 745.699872
 */
export const powerToSI = POWER.toSI;
/**
 * Power in W to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - power, W
 * @param unitName - one of POWER_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns power in `unitName`
 * @example
 * // exact
 * powerFromSI(1500, 'kW') // => 1.5
 */
export const powerFromSI = POWER.fromSI;
/**
 * Volume in `unitName` to m3: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - volume in `unitName`
 * @param unitName - one of VOLUME_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns volume, m3
 * @example
 * // exact: US gallon 3.785411784 L
 * volumeToSI(1000, 'gal') // => 3.785411784
 */
export const volumeToSI = VOLUME.toSI;
/**
 * Volume in m3 to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - volume, m3
 * @param unitName - one of VOLUME_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns volume in `unitName`
 * @example
 * // exact
 * volumeFromSI(2, 'L') // => 2000
 */
export const volumeFromSI = VOLUME.fromSI;
/**
 * Velocity in `unitName` to m/s: value times the unit's factor from the definitions of NIST SP 811 (2008), App. B.
 * @param value - velocity in `unitName`
 * @param unitName - one of VELOCITY_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns velocity, m/s
 * @example
 * // exact: the 5 ft/s limit of plastic pipe
 * velocityToSI(5, 'ft/s') // => 1.524
 */
export const velocityToSI = VELOCITY.toSI;
/**
 * Velocity in m/s to `unitName`: value divided by the unit's factor (NIST SP 811 (2008), App. B).
 * @param value - velocity, m/s
 * @param unitName - one of VELOCITY_UNITS
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns velocity in `unitName`
 * @example
 * // exact
 * velocityFromSI(1.524, 'ft/s') // => 5
 */
export const velocityFromSI = VELOCITY.fromSI;

/**
 * Pressure to the equivalent column of water: h = p / (rho g) (hydrostatics; White, Fluid
 * Mechanics, 7th ed., ch. 2), g the standard 9.80665 m/s2. Valid for any liquid at rest.
 * @param value - pressure in `unitName` (gauge or absolute, as the caller means it)
 * @param unitName - one of PRESSURE_UNITS
 * @param density - liquid density, kg/m3 (see water-properties)
 * @param field - JSON pointer named when the value or unit is rejected
 * @returns head, m
 * @example
 * // 1 bar of water at 20 C: 1e5 / (998.206 x 9.80665) = 10.2155 m by hand
 * pressureToHead(1, 'bar', 998.206) // => 10.2155
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
 * Head of water to pressure: p = rho g h (hydrostatics; White, Fluid Mechanics, 7th ed., ch. 2), g the
 * standard 9.80665 m/s2.
 * @param head - head of liquid, m
 * @param unitName - one of PRESSURE_UNITS
 * @param density - liquid density, kg/m3
 * @param field - JSON pointer named when the unit is rejected
 * @returns pressure in `unitName`
 * @example
 * // 10 m of water at 1000 kg/m3: 98066.5 Pa exactly, 14.2233 psi by hand (6894.757 Pa/psi)
 * headToPressure(10, 'kPa', 1000) // => 98.0665
 * headToPressure(10, 'psi', 1000) // => 14.2233
 */
export function headToPressure(head: number, unitName: PressureUnit, density: number, field = '/pressureUnit'): number {
  requirePositive(density, '/density', 'density');
  return pressureFromSI(requireFinite(head, '/head', 'head') * density * STANDARD_GRAVITY, unitName, field);
}
