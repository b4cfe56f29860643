import { Op, type Transaction } from 'sequelize';
import type { ApiTokenRevokedReason, RevokedApiTokens } from '../../shared/api/api-schemas';
import { ApiToken } from '../database/models';
import { toApiTokenSummary } from './user-views';

/**
 * Revokes every live personal API token of the user, saying why, inside the caller's transaction;
 * answers them as they now stand. Expired tokens are left as they are: they already stopped working.
 */
export async function revokeLiveApiTokens(
  userId: number,
  reason: ApiTokenRevokedReason,
  transaction: Transaction,
  now = new Date(),
): Promise<RevokedApiTokens> {
  const live = await ApiToken.findAll({
    where: { userId, revokedAt: null, [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: now } }] },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (live.length > 0)
    await ApiToken.update(
      { revokedAt: now, revokedReason: reason },
      { where: { id: live.map((apiToken) => apiToken.id) }, transaction },
    );
  const revoked = live.map((apiToken) => toApiTokenSummary(apiToken.set({ revokedAt: now, revokedReason: reason })));
  return { revokedApiTokenCount: revoked.length, revokedApiTokens: revoked };
}
