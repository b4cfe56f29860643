import { engineInputErrorText } from '../messages/engine-issue-text';
import type { EngineInputError } from './engine-issues';

/**
 * The one error type the hydraulics engine throws for bad input.
 *
 * `field` is a JSON-pointer-like path to the offending input (for example
 * `/segments/0/length`), so the API can point a client at the exact value.
 */
export class HydraulicsInputError extends Error {
  readonly field: string;
  readonly issue: EngineInputError;

  constructor(issue: EngineInputError) {
    super(engineInputErrorText(issue));
    this.name = 'HydraulicsInputError';
    this.field = issue.pointer;
    this.issue = issue;
  }
}

/** Why `value` is not a finite number, or null when it is. */
export function finiteError(value: number, field: string, what = 'value'): EngineInputError | null {
  return typeof value !== 'number' || !Number.isFinite(value)
    ? { code: 'not-finite', params: { what, value }, pointer: field }
    : null;
}

/** Why `value` is not finite and greater than zero, or null when it is. */
export function positiveError(value: number, field: string, what = 'value'): EngineInputError | null {
  return (
    finiteError(value, field, what) ??
    (value <= 0 ? { code: 'not-positive', params: { what, value }, pointer: field } : null)
  );
}

/** Why `value` is not finite and within [min, max], or null when it is. */
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

/** Throws unless `value` is a finite number (not NaN, not +-Infinity). */
export function requireFinite(value: number, field: string, what = 'value'): number {
  unless(finiteError(value, field, what));
  return value;
}

/** Throws unless `value` is finite and strictly greater than zero. */
export function requirePositive(value: number, field: string, what = 'value'): number {
  unless(positiveError(value, field, what));
  return value;
}

/** Throws unless `value` is finite and zero or greater. */
export function requireNonNegative(value: number, field: string, what = 'value'): number {
  requireFinite(value, field, what);
  if (value < 0) throw new HydraulicsInputError({ code: 'negative', params: { what, value }, pointer: field });
  return value;
}

/** Throws unless `value` is finite and lies in [min, max]. */
export function requireInRange(value: number, min: number, max: number, field: string, what = 'value'): number {
  unless(rangeError(value, min, max, field, what));
  return value;
}
