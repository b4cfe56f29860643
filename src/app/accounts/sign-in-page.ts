import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { AuthApi } from '../core/auth-api';
import { describeHttpError } from '../core/problem-details';
import { SessionService } from '../core/session-service';

/** E-mail and password; on success the user goes back where they were headed. */
@Component({
  selector: 'rf-sign-in-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  templateUrl: './sign-in-page.html',
  styleUrl: './account-forms.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly authApi = inject(AuthApi);
  private readonly session = inject(SessionService);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  /** Where to go after signing in (from the query string). */
  readonly returnTo = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    password: ['', [Validators.required, Validators.maxLength(200)]],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.authApi.signIn(this.form.getRawValue()).subscribe({
      next: (signedIn) => {
        this.session.start(signedIn);
        // The refused attempt's message has served its purpose once the user is in.
        this.snackBar.dismiss();
        const target = this.returnTo();
        void this.router.navigateByUrl(target && target.startsWith('/') && !target.startsWith('//') ? target : '/');
      },
      error: (error: HttpErrorResponse) => {
        this.busy.set(false);
        this.problem.set(describeHttpError(error));
      },
    });
  }
}
