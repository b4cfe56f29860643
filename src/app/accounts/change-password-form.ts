import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { describeHttpError } from '../core/problem-details';
import { AccountApi } from './account-api';
import { newPasswordValidators, passwordsMatch } from './account-validators';
import { NewPasswordFields } from './new-password-fields';

/** Change the password from the account page: the current one, then the new one twice. */
@Component({
  selector: 'rf-change-password-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, NewPasswordFields],
  templateUrl: './change-password-form.html',
  styleUrl: './account-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangePasswordForm {
  private readonly accountApi = inject(AccountApi);
  private readonly formBuilder = inject(NonNullableFormBuilder);

  protected readonly form = this.formBuilder.group({
    currentPassword: ['', [Validators.required, Validators.maxLength(200)]],
    next: this.formBuilder.group(
      { password: ['', newPasswordValidators], confirmation: [''] },
      { validators: passwordsMatch },
    ),
  });
  protected readonly saving = signal(false);
  protected readonly done = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected submit(formDirective: FormGroupDirective): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, next } = this.form.getRawValue();
    this.problem.set(null);
    this.done.set(false);
    this.saving.set(true);
    this.accountApi.changePassword({ currentPassword, newPassword: next.password }).subscribe({
      next: () => {
        this.saving.set(false);
        this.done.set(true);
        formDirective.resetForm();
      },
      error: (error: HttpErrorResponse) => {
        this.saving.set(false);
        this.problem.set(describeHttpError(error));
      },
    });
  }
}
