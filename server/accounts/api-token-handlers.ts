import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import type { CreatedApiToken, NewApiToken } from '../../shared/api/api-schemas';
import { ProblemError } from '../api/problem-details';
import { ApiToken, User } from '../database/models';
import { recordAuditEvent } from './audit-log';
import { currentUser } from './authenticated-user';
import { verifyPassword } from './passwords';
import { newSecretToken } from './secret-tokens';
import { toApiTokenSummary } from './user-views';
import { checkedName } from '../api/checked-text';

const dayMs = 24 * 3600_000;

function wrongPassword(): ProblemError {
  return new ProblemError(
    403,
    'Wrong password',
    'The password is not right; a new API token needs the password of the account',
    [{ pointer: '/body/password', detail: 'is not right' }],
    'wrong-password',
  );
}

/**
 * Personal API tokens: each user sees and revokes only their own. Making one asks for the
 * password again, so that a stolen session cannot leave behind a token that outlives a reset.
 */
export function createApiTokenHandlers(sequelize: Sequelize): Record<string, RequestHandler> {
  return {
    listApiTokens: async (request, response) => {
      const tokens = await ApiToken.findAll({
        where: { userId: currentUser(request).id },
        order: [
          ['createdAt', 'DESC'],
          ['id', 'DESC'],
        ],
      });
      response.set('Cache-Control', 'no-store').json({ tokens: tokens.map(toApiTokenSummary) });
    },

    createApiToken: async (request, response) => {
      const user = currentUser(request);
      const body = request.body as NewApiToken;
      const name = checkedName(body.name, '/body/name');
      const owner = await User.findByPk(user.id, { rejectOnEmpty: true });
      if (!(await verifyPassword(owner.passwordHash, body.password))) {
        await recordAuditEvent(request, {
          action: 'api-token-create-failed',
          subjectUserId: user.id,
          email: owner.email,
          detail: 'wrong password',
        });
        throw wrongPassword();
      }
      const { token, hash, prefix } = newSecretToken('apiToken');
      const created = await sequelize.transaction(async (transaction) => {
        const apiToken = await ApiToken.create(
          {
            userId: user.id,
            name,
            tokenPrefix: prefix,
            tokenHash: hash,
            scopes: body.scopes,
            expiresAt: body.expiresInDays ? new Date(Date.now() + body.expiresInDays * dayMs) : null,
          },
          { transaction },
        );
        await recordAuditEvent(
          request,
          {
            action: 'api-token-created',
            actorUserId: user.id,
            subjectUserId: user.id,
            detail: `${prefix} "${apiToken.name}" scopes ${body.scopes.join(' ')}`,
          },
          transaction,
        );
        return apiToken;
      });
      const answer: CreatedApiToken = { token, apiToken: toApiTokenSummary(created) };
      response.status(201).set('Cache-Control', 'no-store').json(answer);
    },

    revokeApiToken: async (request, response) => {
      const user = currentUser(request);
      const tokenId = Number(request.params.tokenId);
      await sequelize.transaction(async (transaction) => {
        // Someone else's token is as absent as one that never existed.
        const apiToken = await ApiToken.findOne({
          where: { id: tokenId, userId: user.id },
          transaction,
          lock: transaction.LOCK.UPDATE,
        });
        if (!apiToken)
          throw new ProblemError(404, 'Not found', `You have no API token ${tokenId}`, [
            { pointer: '/path/tokenId', detail: 'is not one of your tokens' },
          ]);
        if (apiToken.revokedAt) return;
        await apiToken.update({ revokedAt: new Date(), revokedReason: 'owner' }, { transaction });
        await recordAuditEvent(
          request,
          {
            action: 'api-token-revoked',
            actorUserId: user.id,
            subjectUserId: user.id,
            detail: `${apiToken.tokenPrefix} "${apiToken.name}"`,
          },
          transaction,
        );
      });
      response.status(204).end();
    },
  };
}
