import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { passwordMinLength } from './account-validators';

export type NewPasswordGroup = FormGroup<{ password: FormControl<string>; confirmation: FormControl<string> }>;

/** A new password typed twice, with the rules said before the user trips over them. */
@Component({
  selector: 'rf-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <div [formGroup]="group()" class="rf-new-password">
      <mat-form-field appearance="outline">
        <mat-label>New password</mat-label>
        <input matInput type="password" formControlName="password" autocomplete="new-password" />
        <mat-hint>At least {{ minLength }} characters; not a common password.</mat-hint>
        @if (group().controls.password.hasError('required')) {
          <mat-error>Choose a password.</mat-error>
        } @else if (group().controls.password.hasError('minlength')) {
          <mat-error>Use at least {{ minLength }} characters; a few words make a good one.</mat-error>
        } @else if (group().controls.password.hasError('maxlength')) {
          <mat-error>Use at most 200 characters.</mat-error>
        }
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>The same password again</mat-label>
        <input matInput type="password" formControlName="confirmation" autocomplete="new-password" />
        @if (group().hasError('mismatch') && group().controls.confirmation.touched) {
          <mat-hint class="rf-mismatch">The two passwords differ.</mat-hint>
        }
      </mat-form-field>
    </div>
  `,
  styles: `
    .rf-new-password {
      display: flex;
      flex-direction: column;
      gap: 0.5rem;
    }
    .rf-mismatch {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  readonly group = input.required<NewPasswordGroup>();
  protected readonly minLength = passwordMinLength;
}
