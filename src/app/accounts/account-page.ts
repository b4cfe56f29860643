import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { ApiTokenSummary } from '../../../shared/api/api-schemas';
import { roleLabel } from '../core/role-labels';
import { SessionService } from '../core/session-service';
import { AccountApi } from './account-api';
import { ApiTokenDialog } from './api-token-dialog';
import { ChangePasswordForm } from './change-password-form';

/**
 * Who is signed in, a password change, and their personal API tokens: create (shown once), list,
 * revoke; revoked tokens say when and why, so that after a password reset the user knows what to make again.
 */
@Component({
  selector: 'rf-account-page',
  imports: [DatePipe, RouterLink, MatCardModule, MatTableModule, MatButtonModule, MatIconModule, ChangePasswordForm],
  templateUrl: './account-page.html',
  styleUrl: './account-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountPage {
  private readonly accountApi = inject(AccountApi);
  private readonly dialog = inject(MatDialog);
  protected readonly user = inject(SessionService).user;
  protected readonly roleName = computed(() => roleLabel(this.user()?.role));

  protected readonly tokens = signal<ApiTokenSummary[]>([]);
  protected readonly loaded = signal(false);
  protected readonly columns = ['name', 'prefix', 'scopes', 'createdAt', 'lastUsedAt', 'expiresAt', 'actions'];
  /** The tokens the latest password reset took away, for the note above the table. */
  protected readonly revokedByReset = computed(() => {
    const byReset = this.tokens().filter((token) => token.revokedReason === 'password-reset');
    const latest = byReset.reduce((last, token) => (token.revokedAt! > last ? token.revokedAt! : last), '');
    return byReset.filter((token) => token.revokedAt === latest);
  });

  constructor() {
    this.reload();
  }

  protected isLive(token: ApiTokenSummary): boolean {
    return token.revokedAt === null && (token.expiresAt === null || Date.parse(token.expiresAt) > Date.now());
  }

  protected openCreateDialog(): void {
    this.dialog
      .open(ApiTokenDialog, { width: '36rem', disableClose: true, autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((created) => {
        if (created) this.reload();
      });
  }

  protected revoke(token: ApiTokenSummary): void {
    this.accountApi.revokeApiToken(token.id).subscribe(() => this.reload());
  }

  protected reload(): void {
    this.accountApi.listApiTokens().subscribe(({ tokens }) => {
      this.tokens.set(tokens);
      this.loaded.set(true);
    });
  }
}
