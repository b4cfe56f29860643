import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { CalculationUnits } from '../../../shared/api/api-schemas';
import { designBranchStaticHead } from '../../../shared/api/design-system';
import { systemInputOf } from '../../../shared/api/system-input';
import { staticHeadOf, toPipeSystem, type SystemDraft } from './system-draft';
import {
  checkPlausibleInUnits,
  compileSuctionSide,
  plausibilityMessage,
  type PlausibleLimitName,
} from '../../../shared/hydraulics';

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

/**
 * The contract's floor for lengths and flows (`exclusiveMinimum: 0`): more than zero, however
 * little; the plausibility table's floor of zero lets zero itself through, the contract does not.
 */
export function aboveZero(control: AbstractControl): ValidationErrors | null {
  const value: unknown = control.value;
  return typeof value === 'number' && value <= 0 ? { aboveZero: true } : null;
}

/**
 * The static head two measured levels give (discharge above intake), held to the static head's
 * limit; on the form group, since neither level alone is the head.
 */
export function plausibleLevelsValidator(units: () => CalculationUnits): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const draft = group.value as SystemDraft;
    if (
      draft.branches?.length ||
      draft.staticMode !== 'levels' ||
      typeof draft.intakeLevel !== 'number' ||
      typeof draft.dischargeLevel !== 'number'
    )
      return null;
    const problem = plausibleInputProblem('staticHead', staticHeadOf(draft), units());
    return problem ? { plausibleLevels: problem } : null;
  };
}

/**
 * Each branch's static head from its measured outlet level, held to the static head's limit; on
 * the system's form group (the intake level is the system's).
 */
export function plausibleBranchLevelsValidator(units: () => CalculationUnits): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const draft = group.getRawValue() as SystemDraft;
    for (const branch of draft.branches ?? []) {
      if (branch.staticMode !== 'levels' || typeof branch.outletLevel !== 'number') continue;
      const problem = plausibleInputProblem('staticHead', designBranchStaticHead(branch, draft), units());
      if (problem) return { branchLevels: `${branch.name}: ${problem}` };
    }
    return null;
  };
}

/**
 * The suction side as the calculations check it (shared/hydraulics/suction-side.ts): suction
 * segments first, a site and pump elevation given with them and in range, no pump elevation
 * without them. `toDraft` gives the form's value as the design's system.
 */
export function suctionSideValidator(
  units: () => CalculationUnits,
  toDraft: (group: AbstractControl) => SystemDraft,
): ValidatorFn {
  return (group: AbstractControl): ValidationErrors | null => {
    const draft = toDraft(group);
    if (!draft.segments.some((segment) => segment.side === 'suction')) return null;
    try {
      compileSuctionSide(systemInputOf({ ...toPipeSystem(draft), staticHead: 0 }, units()));
      return null;
    } catch (error) {
      return { suctionSide: error instanceof Error ? error.message : String(error) };
    }
  };
}
