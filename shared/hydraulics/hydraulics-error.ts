/**
 * The one error type the hydraulics engine throws for bad input.
 *
 * `field` is a JSON-pointer-like path to the offending input (for example
 * `/segments/0/length`), so the API can point a client at the exact value.
 * @example
 * const error = new HydraulicsInputError('/segments/0/length', 'segment length must be greater than zero')
 * error.field // => '/segments/0/length'
 * error.name // => 'HydraulicsInputError'
 */
export class HydraulicsInputError extends Error {
  readonly field: string;

  /**
   * @param field - JSON pointer of the offending input, e.g. `/segments/0/length`
   * @param message - what is wrong with it, for people
   */
  constructor(field: string, message: string) {
    super(message);
    this.name = 'HydraulicsInputError';
    this.field = field;
  }
}

/**
 * Throws HydraulicsInputError unless `value` is a finite number (not NaN, not +-Infinity).
 * @param value - the input, any unit
 * @param field - JSON pointer the error names
 * @param what - the input's name in the message
 * @returns the value, unchanged
 * @example
 * requireFinite(-2.5, '/staticHead') // => -2.5
 */
export function requireFinite(value: number, field: string, what = 'value'): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new HydraulicsInputError(field, `${what} must be a finite number, got ${String(value)}`);
  }
  return value;
}

/**
 * Throws HydraulicsInputError unless `value` is finite and strictly greater than zero.
 * @param value - the input, any unit
 * @param field - JSON pointer the error names
 * @param what - the input's name in the message
 * @returns the value, unchanged
 * @example
 * requirePositive(0.05, '/insideDiameter') // => 0.05
 */
export function requirePositive(value: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value <= 0) {
    throw new HydraulicsInputError(field, `${what} must be greater than zero, got ${value}`);
  }
  return value;
}

/**
 * Throws HydraulicsInputError unless `value` is finite and zero or greater.
 * @param value - the input, any unit
 * @param field - JSON pointer the error names
 * @param what - the input's name in the message
 * @returns the value, unchanged
 * @example
 * requireNonNegative(0, '/flow') // => 0
 */
export function requireNonNegative(value: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value < 0) {
    throw new HydraulicsInputError(field, `${what} must not be negative, got ${value}`);
  }
  return value;
}

/**
 * Throws HydraulicsInputError unless `value` is finite and lies in [min, max].
 * @param value - the input, any unit
 * @param min - lowest accepted value, same unit
 * @param max - highest accepted value, same unit
 * @param field - JSON pointer the error names
 * @param what - the input's name in the message
 * @returns the value, unchanged
 * @example
 * requireInRange(20, 0, 40, '/temperature') // => 20
 */
export function requireInRange(value: number, min: number, max: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value < min || value > max) {
    throw new HydraulicsInputError(field, `${what} must be between ${min} and ${max}, got ${value}`);
  }
  return value;
}
