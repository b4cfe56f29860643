/**
 * The one error type the hydraulics engine throws for bad input.
 *
 * `field` is a JSON-pointer-like path to the offending input (for example
 * `/segments/0/length`), so the API can point a client at the exact value.
 */
export class HydraulicsInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'HydraulicsInputError';
    this.field = field;
  }
}

/** Throws unless `value` is a finite number (not NaN, not +-Infinity). */
export function requireFinite(value: number, field: string, what = 'value'): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new HydraulicsInputError(field, `${what} must be a finite number, got ${String(value)}`);
  }
  return value;
}

/** Throws unless `value` is finite and strictly greater than zero. */
export function requirePositive(value: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value <= 0) {
    throw new HydraulicsInputError(field, `${what} must be greater than zero, got ${value}`);
  }
  return value;
}

/** Throws unless `value` is finite and zero or greater. */
export function requireNonNegative(value: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value < 0) {
    throw new HydraulicsInputError(field, `${what} must not be negative, got ${value}`);
  }
  return value;
}

/** Throws unless `value` is finite and lies in [min, max]. */
export function requireInRange(value: number, min: number, max: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value < min || value > max) {
    throw new HydraulicsInputError(field, `${what} must be between ${min} and ${max}, got ${value}`);
  }
  return value;
}
