import type { Request } from 'express';
import { Op, type Transaction } from 'sequelize';
import type { SignInResponse } from '../../shared/api/api-schemas';
import { Session, type User } from '../database/models';
import { lifetimes } from './accounts-dependencies';
import { hashSecretToken, newSecretToken } from './secret-tokens';
import { toAccountUser } from './user-views';

/** A new session for the user: the token is returned once, the database keeps its hash. */
export async function openSession(user: User, transaction?: Transaction, now = new Date()): Promise<SignInResponse> {
  const { token, hash } = newSecretToken('session');
  const expiresAt = new Date(now.getTime() + lifetimes.sessionMs);
  await Session.create({ userId: user.id, tokenHash: hash, expiresAt }, { transaction });
  return { token, expiresAt: expiresAt.toISOString(), user: toAccountUser(user) };
}

/** The bearer token the request was authenticated with. */
export function presentedToken(request: Request): string {
  return (request.headers.authorization ?? '').replace(/^Bearer\s+/i, '');
}

export async function revokeSession(token: string, userId: number, now = new Date()): Promise<void> {
  await Session.update({ revokedAt: now }, { where: { tokenHash: hashSecretToken(token), userId, revokedAt: null } });
}

/**
 * Signs a user out everywhere, as after a password reset or when the account is disabled; a
 * password change keeps the session it was made from (`keptToken`).
 */
export async function revokeAllSessions(
  userId: number,
  transaction?: Transaction,
  now = new Date(),
  keptToken?: string,
): Promise<void> {
  const kept = keptToken === undefined ? {} : { tokenHash: { [Op.ne]: hashSecretToken(keptToken) } };
  await Session.update(
    { revokedAt: now },
    { where: { userId, revokedAt: null, expiresAt: { [Op.gt]: now }, ...kept }, transaction },
  );
}
