import { Op } from 'sequelize';
import { ApiToken, Session, User } from '../database/models';
import type { AuthenticatedUser } from './authenticated-user';
import { hashSecretToken, secretTokenKindOf } from './secret-tokens';

/** Last-used times are written at most this often per token, not on every request. */
const lastUsedResolutionMs = 60_000;

function toAuthenticatedUser(user: User, via: AuthenticatedUser['via'], scopes: string[]): AuthenticatedUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, supplierId: user.supplierId ?? null, via, scopes };
}

function isStale(lastUsedAt: Date | null, now: Date): boolean {
  return !lastUsedAt || now.getTime() - lastUsedAt.getTime() >= lastUsedResolutionMs;
}

/**
 * The user behind a bearer token: a live session or a live personal API token of an enabled
 * user. Anything else (malformed, unknown, expired, revoked, disabled owner) is undefined.
 */
export async function userForBearerToken(token: string, now = new Date()): Promise<AuthenticatedUser | undefined> {
  const kind = secretTokenKindOf(token);
  if (kind !== 'session' && kind !== 'apiToken') return undefined;
  const live = { tokenHash: hashSecretToken(token), revokedAt: null };
  const include = [{ model: User, as: 'user', where: { disabled: false } }];
  if (kind === 'session') {
    const session = await Session.findOne({ where: { ...live, expiresAt: { [Op.gt]: now } }, include });
    if (!session?.user) return undefined;
    if (isStale(session.lastUsedAt, now)) await session.update({ lastUsedAt: now }, { silent: true });
    return toAuthenticatedUser(session.user, 'session', []);
  }
  const apiToken = await ApiToken.findOne({
    where: { ...live, [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: now } }] },
    include,
  });
  if (!apiToken?.user) return undefined;
  if (isStale(apiToken.lastUsedAt, now)) await apiToken.update({ lastUsedAt: now }, { silent: true });
  return toAuthenticatedUser(apiToken.user, 'api-token', apiToken.scopes);
}
