import type { Request, RequestHandler } from 'express';
import { Op, type Sequelize } from 'sequelize';
import type {
  InvitationAcceptance,
  NewPasswordRequest,
  PasswordChange,
  PasswordResetRequest,
  RevokedApiTokens,
  SignInRequest,
} from '../../shared/api/api-schemas';
import { ProblemError } from '../api/problem-details';
import { Invitation, PasswordResetLink, User } from '../database/models';
import { passwordResetMessage } from './account-mail';
import { lifetimes, type AccountsDependencies } from './accounts-dependencies';
import { revokeLiveApiTokens } from './api-token-revocation';
import { recordAuditEvent } from './audit-log';
import { currentUser } from './authenticated-user';
import { hashPassword, passwordWeakness, verifyPassword } from './passwords';
import { hashSecretToken, newSecretToken } from './secret-tokens';
import { openSession, presentedToken, revokeAllSessions, revokeSession } from './sessions';
import { normaliseEmail, toAccountUser } from './user-views';
import { checkedName } from '../api/checked-text';

const resetAnswer = `If that address has a Riffle account, a reset link is on its way. It works once, within 1 hour.`;

function linkGone(): ProblemError {
  return new ProblemError(
    410,
    'Link expired or already used',
    'This link has expired or was already used; ask for a new one',
    [{ pointer: '/body/token', detail: 'is expired, used or unknown' }],
    'link-gone',
  );
}

function refuseWeakPassword(password: string, email: string, pointer = '/body/password'): void {
  const weakness = passwordWeakness(password, email);
  if (weakness)
    throw new ProblemError(
      422,
      'Password too weak',
      `The password ${weakness}`,
      [{ pointer, detail: weakness }],
      'weak-password',
    );
}

function revokedDetail({ revokedApiTokens }: RevokedApiTokens): string | undefined {
  if (revokedApiTokens.length === 0) return undefined;
  return `API tokens revoked: ${revokedApiTokens.map((apiToken) => apiToken.prefix).join(' ')}`;
}

/** Sign-in, sign-out, who-am-I, a password change, and the two e-mailed links: password reset and invitation. */
export function createAuthHandlers(
  sequelize: Sequelize,
  dependencies: AccountsDependencies,
): Record<string, RequestHandler> {
  const sendResetLink = async (request: Request, email: string): Promise<void> => {
    const user = await User.findOne({ where: { email, disabled: false } });
    if (!user) return;
    const { token, hash } = newSecretToken('emailLink');
    await PasswordResetLink.create({
      userId: user.id,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + lifetimes.resetLinkMs),
    });
    await recordAuditEvent(request, { action: 'password-reset-requested', subjectUserId: user.id, email });
    await dependencies.mailer.send(
      passwordResetMessage({
        to: user.email,
        link: `${dependencies.publicUrl}/accounts/reset-password?token=${token}`,
        validForMs: lifetimes.resetLinkMs,
      }),
    );
  };

  return {
    signIn: async (request, response) => {
      const body = request.body as SignInRequest;
      const email = normaliseEmail(body.email);
      const user = await User.findOne({ where: { email } });
      const matches = await verifyPassword(user?.passwordHash, body.password);
      if (!user || !matches || user.disabled) {
        await recordAuditEvent(request, {
          action: 'sign-in-failed',
          subjectUserId: user?.id,
          email,
          detail: user?.disabled && matches ? 'account disabled' : 'wrong e-mail or password',
        });
        throw new ProblemError(
          401,
          'Wrong e-mail or password',
          'The e-mail address or the password is not right, or the account is disabled',
          [],
          'wrong-credentials',
        );
      }
      const signedIn = await openSession(user);
      await recordAuditEvent(request, { action: 'sign-in', actorUserId: user.id, subjectUserId: user.id, email });
      response.set('Cache-Control', 'no-store').json(signedIn);
    },

    signOut: async (request, response) => {
      const user = currentUser(request);
      await revokeSession(presentedToken(request), user.id);
      await recordAuditEvent(request, { action: 'sign-out', actorUserId: user.id, subjectUserId: user.id });
      response.status(204).end();
    },

    getCurrentUser: async (request, response) => {
      response.set('Cache-Control', 'no-store').json(toAccountUser(currentUser(request)));
    },

    changePassword: async (request, response) => {
      const body = request.body as PasswordChange;
      const { id } = currentUser(request);
      const user = await User.findByPk(id, { rejectOnEmpty: true });
      if (!(await verifyPassword(user.passwordHash, body.currentPassword))) {
        await recordAuditEvent(request, {
          action: 'password-change-failed',
          subjectUserId: user.id,
          email: user.email,
          detail: 'wrong current password',
        });
        throw new ProblemError(
          422,
          'Wrong current password',
          'The current password is not right',
          [{ pointer: '/body/currentPassword', detail: 'is not right' }],
          'wrong-current-password',
        );
      }
      refuseWeakPassword(body.newPassword, user.email, '/body/newPassword');
      const passwordHash = await hashPassword(body.newPassword);
      const now = new Date();
      const revoked = await sequelize.transaction(async (transaction) => {
        await User.update({ passwordHash }, { where: { id: user.id }, transaction });
        await revokeAllSessions(user.id, transaction, now, presentedToken(request));
        const tokens = body.revokeApiTokens
          ? await revokeLiveApiTokens(user.id, 'password-change', transaction, now)
          : { revokedApiTokenCount: 0, revokedApiTokens: [] };
        await recordAuditEvent(
          request,
          {
            action: 'password-changed',
            actorUserId: user.id,
            subjectUserId: user.id,
            email: user.email,
            detail: revokedDetail(tokens),
          },
          transaction,
        );
        return tokens;
      });
      response.set('Cache-Control', 'no-store').json(revoked);
    },

    requestPasswordReset: async (request, response) => {
      const email = normaliseEmail((request.body as PasswordResetRequest).email);
      // Answer first, the same for every address, so neither the words nor the time tell whether it has an account.
      response.status(202).json({ message: resetAnswer });
      sendResetLink(request, email).catch((error: unknown) =>
        request.log.error({ err: error }, 'password reset link not sent'),
      );
    },

    resetPassword: async (request, response) => {
      const body = request.body as NewPasswordRequest;
      const now = new Date();
      const link = await PasswordResetLink.findOne({
        where: { tokenHash: hashSecretToken(body.token), usedAt: null, expiresAt: { [Op.gt]: now } },
        include: [{ model: User, as: 'user', where: { disabled: false } }],
      });
      const user = link?.user;
      if (!link || !user) throw linkGone();
      refuseWeakPassword(body.password, user.email);
      const passwordHash = await hashPassword(body.password);
      const revoked = await sequelize.transaction(async (transaction) => {
        // Taking the link and changing the password in one step: a second use finds no unused link.
        const [taken] = await PasswordResetLink.update(
          { usedAt: now },
          { where: { id: link.id, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
        );
        if (taken !== 1) throw linkGone();
        await User.update({ passwordHash }, { where: { id: user.id }, transaction });
        await revokeAllSessions(user.id, transaction, now);
        // A reset answers a suspected compromise: tokens a stolen session made must die with it.
        const tokens = await revokeLiveApiTokens(user.id, 'password-reset', transaction, now);
        await recordAuditEvent(
          request,
          {
            action: 'password-reset',
            actorUserId: user.id,
            subjectUserId: user.id,
            email: user.email,
            detail: revokedDetail(tokens),
          },
          transaction,
        );
        return tokens;
      });
      response.set('Cache-Control', 'no-store').json(revoked);
    },

    acceptInvitation: async (request, response) => {
      const body = request.body as InvitationAcceptance;
      const now = new Date();
      const invitation = await Invitation.findOne({
        where: { tokenHash: hashSecretToken(body.token), acceptedAt: null, expiresAt: { [Op.gt]: now } },
      });
      if (!invitation) throw linkGone();
      refuseWeakPassword(body.password, invitation.email);
      if (await User.count({ where: { email: invitation.email } })) {
        throw new ProblemError(
          409,
          'Account exists',
          `${invitation.email} already has an account; sign in or reset the password`,
          [],
          'account-exists',
        );
      }
      const passwordHash = await hashPassword(body.password);
      const signedIn = await sequelize.transaction(async (transaction) => {
        const [taken] = await Invitation.update(
          { acceptedAt: now },
          { where: { id: invitation.id, acceptedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
        );
        if (taken !== 1) throw linkGone();
        const user = await User.create(
          {
            email: invitation.email,
            name: checkedName(body.name, '/body/name'),
            role: invitation.role,
            supplierId: invitation.supplierId,
            passwordHash,
          },
          { transaction },
        );
        await recordAuditEvent(
          request,
          {
            action: 'invitation-accepted',
            actorUserId: user.id,
            subjectUserId: user.id,
            email: user.email,
            detail: `role ${user.role}`,
          },
          transaction,
        );
        return openSession(user, transaction, now);
      });
      response.set('Cache-Control', 'no-store').json(signedIn);
    },
  };
}
