import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { describeHttpError } from '../core/problem-details';
import { AccountApi } from './account-api';
import { newPasswordValidators, passwordsMatch } from './account-validators';
import { NewPasswordFields } from './new-password-fields';

/**
 * Change the password from the account page: the current one, then the new one twice, and whether
 * the personal API tokens go too; emits how many tokens were revoked, so the page can list them.
 */
@Component({
  selector: 'rf-change-password-form',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatCheckboxModule,
    NewPasswordFields,
  ],
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
    revokeApiTokens: [false],
  });
  readonly tokensRevoked = output<number>();
  protected readonly saving = signal(false);
  /** How many API tokens the change revoked, once it is done. */
  protected readonly done = signal<{ revokedApiTokenCount: number } | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected submit(formDirective: FormGroupDirective): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, next, revokeApiTokens } = this.form.getRawValue();
    this.problem.set(null);
    this.done.set(null);
    this.saving.set(true);
    this.accountApi.changePassword({ currentPassword, newPassword: next.password, revokeApiTokens }).subscribe({
      next: ({ revokedApiTokenCount }) => {
        this.saving.set(false);
        this.done.set({ revokedApiTokenCount });
        formDirective.resetForm({
          currentPassword: '',
          next: { password: '', confirmation: '' },
          revokeApiTokens: false,
        });
        if (revokedApiTokenCount > 0) this.tokensRevoked.emit(revokedApiTokenCount);
      },
      error: (error: HttpErrorResponse) => {
        this.saving.set(false);
        this.problem.set(describeHttpError(error));
      },
    });
  }
}
