import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { AuthApi } from '../core/auth-api';
import { describeHttpError } from '../core/problem-details';

/** Asks for a reset link by e-mail; the answer never says whether the address has an account. */
@Component({
  selector: 'rf-forgot-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './forgot-password-page.html',
  styleUrl: './account-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly authApi = inject(AuthApi);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
  });
  protected readonly answer = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.problem.set(null);
    this.authApi.requestPasswordReset(this.form.getRawValue()).subscribe({
      next: ({ message }) => this.answer.set(message),
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }
}
