import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { ClipboardModule } from '@angular/cdk/clipboard';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ApiScope, CreatedApiToken } from '../../../shared/api/api-schemas';
import { describeHttpError } from '../core/problem-details';
import { AccountApi } from './account-api';
import { visibleTextPattern } from './account-validators';
import { apiScopeChoices } from './api-scopes';

/** Creates a personal API token and shows it this one time, with a copy button; closes with the new token or nothing. */
@Component({
  selector: 'rf-api-token-dialog',
  imports: [
    ReactiveFormsModule,
    ClipboardModule,
    MatDialogModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatIconModule,
  ],
  templateUrl: './api-token-dialog.html',
  styleUrl: './api-token-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiTokenDialog {
  private readonly accountApi = inject(AccountApi);
  private readonly dialogRef = inject<MatDialogRef<ApiTokenDialog, CreatedApiToken | undefined>>(MatDialogRef);
  private readonly formBuilder = inject(NonNullableFormBuilder);

  protected readonly scopeChoices = apiScopeChoices;
  protected readonly expiryChoices = [
    { days: 30, label: '30 days' },
    { days: 90, label: '90 days' },
    { days: 365, label: 'One year' },
    { days: 0, label: 'Never (revoke it yourself)' },
  ];
  protected readonly form = this.formBuilder.group({
    name: ['', [Validators.required, Validators.maxLength(80), Validators.pattern(visibleTextPattern)]],
    scopes: this.formBuilder.group(
      Object.fromEntries(
        apiScopeChoices.map(({ scope }) => [scope, new FormControl(false, { nonNullable: true })]),
      ) as Record<ApiScope, FormControl<boolean>>,
    ),
    expiresInDays: [90],
    // asked again so that a session left open, or stolen, cannot make a token on its own
    password: ['', [Validators.required, Validators.maxLength(200)]],
  });
  protected readonly created = signal<CreatedApiToken | null>(null);
  protected readonly copied = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly noScope = signal(false);

  protected create(): void {
    const { name, scopes, expiresInDays, password } = this.form.getRawValue();
    const chosen = apiScopeChoices.map(({ scope }) => scope).filter((scope) => scopes[scope]);
    this.noScope.set(chosen.length === 0);
    if (this.form.invalid || chosen.length === 0) {
      this.form.markAllAsTouched();
      return;
    }
    this.problem.set(null);
    this.accountApi
      .createApiToken({ name, scopes: chosen, password, ...(expiresInDays > 0 ? { expiresInDays } : {}) })
      .subscribe({
        next: (created) => this.created.set(created),
        error: (error: HttpErrorResponse) => {
          this.form.controls.password.reset();
          this.problem.set(describeHttpError(error));
        },
      });
  }

  protected close(): void {
    this.dialogRef.close(this.created() ?? undefined);
  }
}
