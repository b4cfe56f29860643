import { Op } from 'sequelize';
import { ApiToken, Session, User } from '../database/models';
import { credentialChanges } from '../database/models/credential-changes';
import type { AuthenticatedUser } from './authenticated-user';
import { hashSecretToken, secretTokenKindOf } from './secret-tokens';

/** Last-used times are written at most this often per token, not on every request. */
const lastUsedResolutionMs = 60_000;

/**
 * A token found live is trusted this long without asking the database again (never past its own
 * expiry). Every change Riffle makes to users, sessions or tokens empties the cache when it commits
 * (credentialChanges), so sign-out, revocation, disabling and role changes count at once; the
 * period bounds only edits made to the database from outside the app.
 */
const trustedForMs = 5_000;
const maxCachedTokens = 10_000;
const cache = new Map<string, { user: AuthenticatedUser; until: number }>();
/** Counts changes, so that a lookup that read the database before a change is not remembered after it. */
let generation = 0;
credentialChanges.on('changed', () => {
  generation += 1;
  cache.clear();
});

function remember(
  tokenHash: string,
  user: AuthenticatedUser,
  now: Date,
  expiresAt: Date | null,
  readIn: number,
): AuthenticatedUser {
  if (readIn !== generation) return user;
  if (cache.size >= maxCachedTokens) cache.delete(cache.keys().next().value as string);
  const until = Math.min(now.getTime() + trustedForMs, expiresAt?.getTime() ?? Number.POSITIVE_INFINITY);
  cache.set(tokenHash, { user, until });
  return user;
}

function toAuthenticatedUser(user: User, via: AuthenticatedUser['via'], scopes: string[]): AuthenticatedUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    supplierId: user.supplierId ?? null,
    via,
    scopes,
  };
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
  const tokenHash = hashSecretToken(token);
  const cached = cache.get(tokenHash);
  if (cached && cached.until > now.getTime()) return cached.user;
  const readIn = generation;
  const live = { tokenHash, revokedAt: null };
  const include = [{ model: User, as: 'user', where: { disabled: false } }];
  if (kind === 'session') {
    const session = await Session.findOne({ where: { ...live, expiresAt: { [Op.gt]: now } }, include });
    if (!session?.user) return undefined;
    if (isStale(session.lastUsedAt, now)) await session.update({ lastUsedAt: now }, { silent: true });
    return remember(tokenHash, toAuthenticatedUser(session.user, 'session', []), now, session.expiresAt, readIn);
  }
  const apiToken = await ApiToken.findOne({
    where: { ...live, [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: now } }] },
    include,
  });
  if (!apiToken?.user) return undefined;
  if (isStale(apiToken.lastUsedAt, now)) await apiToken.update({ lastUsedAt: now }, { silent: true });
  return remember(
    tokenHash,
    toAuthenticatedUser(apiToken.user, 'api-token', apiToken.scopes),
    now,
    apiToken.expiresAt,
    readIn,
  );
}
