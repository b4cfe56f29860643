import { AbstractControl, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';
import { visibleTextPattern } from '../../../shared/text-rules';

/** The server's rule, checked early in the browser: it also refuses common passwords and ones containing the e-mail address. */
export const passwordMinLength = 10;

export const newPasswordValidators: ValidatorFn[] = [
  Validators.required,
  Validators.minLength(passwordMinLength),
  Validators.maxLength(200),
];

/** A form-level check that the two password fields agree. */
export const passwordsMatch: ValidatorFn = (group: AbstractControl): ValidationErrors | null =>
  group.get('password')?.value === group.get('confirmation')?.value ? null : { mismatch: true };

/** Names and labels as the server accepts them (the shared text rule). */
export { visibleTextPattern };

export const personNameValidators: ValidatorFn[] = [
  Validators.required,
  Validators.maxLength(120),
  Validators.pattern(visibleTextPattern),
];
