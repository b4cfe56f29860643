import type { Sequelize } from 'sequelize';
import type { ApiScope, Role } from '../../server/accounts/authenticated-user';
import { hashPassword } from '../../server/accounts/passwords';
import { openSession } from '../../server/accounts/sessions';
import { newSecretToken } from '../../server/accounts/secret-tokens';
import { ApiToken, User } from '../../server/database/models';

/** The password of every account these functions make. */
export const testPassword = 'gravel-bed-weir-42';

let accountCount = 0;
let testPasswordHash: Promise<string> | undefined;

/**
 * A user of the given role in the database the models are bound to (a scratch database), with
 * a live session token for `Authorization: Bearer`. A supplier-admin needs `supplierId`.
 */
export async function createUserWithSession(
  _sequelize: Sequelize,
  role: Role,
  options: { supplierId?: number; email?: string; name?: string } = {},
): Promise<{ user: User; token: string }> {
  if (role === 'supplier-admin' && options.supplierId === undefined) throw new Error('a supplier-admin needs options.supplierId');
  testPasswordHash ??= hashPassword(testPassword);
  const user = await User.create({
    email: options.email ?? `${role}-${process.pid}-${++accountCount}@accounts.test`,
    name: options.name ?? `Test ${role} ${accountCount}`,
    role,
    supplierId: role === 'supplier-admin' ? options.supplierId! : null,
    passwordHash: await testPasswordHash,
  });
  const { token } = await openSession(user);
  return { user, token };
}

/** Another live session token for an existing user. */
export async function createSession(userId: number): Promise<string> {
  const user = await User.findByPk(userId, { rejectOnEmpty: true });
  return (await openSession(user)).token;
}

/** A personal API token of the user with these scopes; `expiresAt` may lie in the past to test expiry. */
export async function createApiToken(
  _sequelize: Sequelize,
  userId: number,
  scopes: readonly ApiScope[],
  options: { expiresAt?: Date | null; name?: string } = {},
): Promise<string> {
  const { token, hash, prefix } = newSecretToken('apiToken');
  await ApiToken.create({ userId, name: options.name ?? 'test token', tokenPrefix: prefix, tokenHash: hash, scopes: [...scopes], expiresAt: options.expiresAt ?? null });
  return token;
}
