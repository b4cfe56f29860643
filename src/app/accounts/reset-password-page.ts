import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { RouterLink } from '@angular/router';
import type { RevokedApiTokens } from '../../../shared/api/api-schemas';
import { AuthApi } from '../core/auth-api';
import { describeHttpError } from '../core/problem-details';
import { NewPasswordFields } from './new-password-fields';
import { newPasswordValidators, passwordsMatch } from './account-validators';

/** Opened from the e-mailed reset link (`?token=`): choose a new password once. */
@Component({
  selector: 'rf-reset-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatButtonModule, NewPasswordFields],
  templateUrl: './reset-password-page.html',
  styleUrl: './account-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly authApi = inject(AuthApi);

  readonly token = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group(
    { password: ['', newPasswordValidators], confirmation: [''] },
    { validators: passwordsMatch },
  );
  /** What the reset revoked, once it is done. */
  protected readonly revoked = signal<RevokedApiTokens | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected submit(): void {
    const token = this.token();
    if (!token) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.problem.set(null);
    this.authApi.resetPassword({ token, password: this.form.getRawValue().password }).subscribe({
      next: (revoked) => this.revoked.set(revoked),
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }
}
