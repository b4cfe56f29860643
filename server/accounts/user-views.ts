import type { AccountUser, AdminUser, ApiTokenSummary } from '../../shared/api/api-schemas';
import type { ApiToken, User } from '../database/models';

export function toAccountUser(user: Pick<User, 'id' | 'email' | 'name' | 'role' | 'supplierId'>): AccountUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, supplierId: user.supplierId ?? null };
}

export function toAdminUser(user: User): AdminUser {
  return { ...toAccountUser(user), disabled: user.disabled, createdAt: user.createdAt.toISOString() };
}

/** E-mail addresses are compared and stored in lower case, without surrounding spaces. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** A personal API token as its owner sees it: never the token, only its prefix. */
export function toApiTokenSummary(apiToken: ApiToken): ApiTokenSummary {
  return {
    id: apiToken.id,
    name: apiToken.name,
    prefix: apiToken.tokenPrefix,
    scopes: apiToken.scopes,
    createdAt: apiToken.createdAt.toISOString(),
    lastUsedAt: apiToken.lastUsedAt?.toISOString() ?? null,
    expiresAt: apiToken.expiresAt?.toISOString() ?? null,
    revokedAt: apiToken.revokedAt?.toISOString() ?? null,
    revokedReason: apiToken.revokedReason ?? null,
  };
}
