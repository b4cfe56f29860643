import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router } from '@angular/router';
import { AuthApi } from '../core/auth-api';
import { describeHttpError } from '../core/problem-details';
import { SessionService } from '../core/session-service';
import { NewPasswordFields } from './new-password-fields';
import { newPasswordValidators, passwordsMatch, personNameValidators } from './account-validators';

/** Opened from the e-mailed invitation (`?token=`): name and password, then signed in. */
@Component({
  selector: 'rf-accept-invitation-page',
  imports: [ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, NewPasswordFields],
  templateUrl: './accept-invitation-page.html',
  styleUrl: './account-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcceptInvitationPage {
  private readonly authApi = inject(AuthApi);
  private readonly session = inject(SessionService);
  private readonly router = inject(Router);

  readonly token = input<string>();

  private readonly formBuilder = inject(NonNullableFormBuilder);
  protected readonly form = this.formBuilder.group({
    name: ['', personNameValidators],
    secret: this.formBuilder.group(
      { password: ['', newPasswordValidators], confirmation: [''] },
      { validators: passwordsMatch },
    ),
  });
  protected readonly problem = signal<string | null>(null);

  protected submit(): void {
    const token = this.token();
    if (!token) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.problem.set(null);
    const { name, secret } = this.form.getRawValue();
    this.authApi.acceptInvitation({ token, name, password: secret.password }).subscribe({
      next: (signedIn) => {
        this.session.start(signedIn);
        void this.router.navigateByUrl('/account');
      },
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }
}
