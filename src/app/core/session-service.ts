import { Injectable, computed, signal } from '@angular/core';
import type { AccountUser, Role, SignInResponse } from '../../../shared/api/api-schemas';

const storageKey = 'riffle.session';

/** The signed-in session: its bearer token and user, kept across reloads until it expires or the user signs out. */
@Injectable({ providedIn: 'root' })
export class SessionService {
  private readonly current = signal<SignInResponse | null>(SessionService.restore());

  readonly user = computed<AccountUser | null>(() => this.current()?.user ?? null);
  readonly role = computed<Role | null>(() => this.user()?.role ?? null);
  readonly signedIn = computed(() => this.current() !== null);

  /** The token for the Authorization header, while the session has not expired. */
  token(): string | null {
    const session = this.current();
    if (!session) return null;
    if (Date.parse(session.expiresAt) <= Date.now()) {
      this.end();
      return null;
    }
    return session.token;
  }

  start(session: SignInResponse): void {
    localStorage.setItem(storageKey, JSON.stringify(session));
    this.current.set(session);
  }

  end(): void {
    localStorage.removeItem(storageKey);
    this.current.set(null);
  }

  hasRole(roles: readonly string[] | undefined): boolean {
    const role = this.role();
    return roles === undefined || (role !== null && roles.includes(role));
  }

  private static restore(): SignInResponse | null {
    try {
      const stored = JSON.parse(localStorage.getItem(storageKey) ?? 'null') as SignInResponse | null;
      return stored && Date.parse(stored.expiresAt) > Date.now() ? stored : null;
    } catch {
      return null;
    }
  }
}
