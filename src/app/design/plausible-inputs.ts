import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { CalculationUnits } from '../../../shared/api/api-schemas';
import { checkPlausibleInUnits, plausibilityMessage, type PlausibleLimitName } from '../../../shared/hydraulics';

/**
 * The API's plausibility limits (shared/hydraulics/plausible-limits.ts) on a value typed in the
 * form's units: the sentence the form shows, or null when the API would accept it.
 */
export function plausibleInputProblem(
  limit: PlausibleLimitName,
  value: number,
  units: CalculationUnits,
): string | null {
  const violation = checkPlausibleInUnits(limit, value, units);
  return violation ? plausibilityMessage(violation, units) : null;
}

/** A form validator for one limit; `units` is read at each check, so a unit switch counts at once. */
export function plausibleValidator(limit: PlausibleLimitName, units: () => CalculationUnits): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const value: unknown = control.value;
    if (typeof value !== 'number' || !Number.isFinite(value)) return null;
    const problem = plausibleInputProblem(limit, value, units());
    return problem ? { plausible: problem } : null;
  };
}
