import type { AccountUser, AdminUser } from '../../shared/api/api-schemas';
import type { User } from '../database/models';

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
