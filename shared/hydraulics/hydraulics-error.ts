import { engineInputErrorText } from '../messages/engine-issue-text';
import type { EngineInputError } from './engine-issues';

/**
 * The one error type the hydraulics engine throws for bad input.
 *
 * `field` is a JSON-pointer-like path to the offending input (for example
 * `/segments/0/length`), so the API can point a client at the exact value.
 * The error carries its code, values (SI) and pointer as `issue`; its message is made from
 * them by one table (shared/messages/engine-issue-text.ts), and an edge may make it again in
 * its reader's units.
 * @example
 * const error = new HydraulicsInputError({ code: 'not-positive', params: { what: 'segment length', value: 0 }, pointer: '/segments/0/length' })
 * error.field // => '/segments/0/length'
 * error.message // => 'segment length must be greater than zero, got 0'
 * error.name // => 'HydraulicsInputError'
 */
export class HydraulicsInputError extends Error {
  readonly field: string;
  readonly issue: EngineInputError;

  /**
   * @param issue - why the input is refused: its code, values (SI) and the JSON pointer of the
   *   offending input, e.g. `/segments/0/length`
   */
  constructor(issue: EngineInputError) {
    super(engineInputErrorText(issue));
    this.name = 'HydraulicsInputError';
    this.field = issue.pointer;
    this.issue = issue;
  }
}

/**
 * Why `value` is not a finite number, or null when it is (the check of requireFinite, for a caller
 * that reports many refusals at once).
 * @param value - the input, any unit
 * @param field - JSON pointer the refusal names
 * @param what - the input's name in the message
 * @returns the refusal, or null
 * @example
 * finiteError(Number.NaN, '/head', 'head').code // => 'not-finite'
 * finiteError(2, '/head', 'head') // => null
 */
export function finiteError(value: number, field: string, what = 'value'): EngineInputError | null {
  return typeof value !== 'number' || !Number.isFinite(value)
    ? { code: 'not-finite', params: { what, value }, pointer: field }
    : null;
}

/**
 * Why `value` is not finite and greater than zero, or null when it is.
 * @param value - the input, any unit
 * @param field - JSON pointer the refusal names
 * @param what - the input's name in the message
 * @returns the refusal, or null
 * @example
 * positiveError(0, '/head', 'head').code // => 'not-positive'
 * positiveError(0.5, '/head', 'head') // => null
 */
export function positiveError(value: number, field: string, what = 'value'): EngineInputError | null {
  return (
    finiteError(value, field, what) ??
    (value <= 0 ? { code: 'not-positive', params: { what, value }, pointer: field } : null)
  );
}

/**
 * Why `value` is not finite and within [min, max], or null when it is.
 * @param value - the input, any unit
 * @param min - lowest accepted value, same unit
 * @param max - highest accepted value, same unit
 * @param field - JSON pointer the refusal names
 * @param what - the input's name in the message
 * @returns the refusal, or null
 * @example
 * rangeError(1.2, 0, 1, '/points/0/efficiency', 'efficiency').pointer // => '/points/0/efficiency'
 * rangeError(0.7, 0, 1, '/points/0/efficiency', 'efficiency') // => null
 */
export function rangeError(
  value: number,
  min: number,
  max: number,
  field: string,
  what = 'value',
): EngineInputError | null {
  return (
    finiteError(value, field, what) ??
    (value < min || value > max ? { code: 'out-of-range', params: { what, value, min, max }, pointer: field } : null)
  );
}

function unless(error: EngineInputError | null): void {
  if (error) throw new HydraulicsInputError(error);
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
  unless(finiteError(value, field, what));
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
  unless(positiveError(value, field, what));
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
  if (value < 0) throw new HydraulicsInputError({ code: 'negative', params: { what, value }, pointer: field });
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
  unless(rangeError(value, min, max, field, what));
  return value;
}
