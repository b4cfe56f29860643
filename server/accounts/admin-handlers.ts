import type { RequestHandler } from 'express';
import { Op, type Sequelize, type Transaction } from 'sequelize';
import type {
  AuditEventsQuery,
  AuditEventView,
  InvitationSummary,
  NewInvitation,
  UserChanges,
} from '../../shared/api/api-schemas';
import { ProblemError } from '../api/problem-details';
import { AuditEvent, Invitation, Supplier, User } from '../database/models';
import { readMailbox } from '../mail/mailbox';
import { invitationMessage } from './account-mail';
import { lifetimes, type AccountsDependencies } from './accounts-dependencies';
import { recordAuditEvent, type AuditEntry } from './audit-log';
import type { Role } from '../../shared/vocabularies';
import { currentUser } from './authenticated-user';
import { newSecretToken } from './secret-tokens';
import { revokeAllSessions } from './sessions';
import { normaliseEmail, toAdminUser } from './user-views';
import { checkedName } from '../api/checked-text';

function unprocessable(pointer: string, detail: string): ProblemError {
  return new ProblemError(422, 'Not possible', detail, [{ pointer, detail }], 'not-possible');
}

/** A supplier-admin is bound to an existing supplier; every other role to none. */
async function checkSupplierBinding(role: Role, supplierId: number | null, transaction?: Transaction): Promise<void> {
  if (role !== 'supplier-admin') {
    if (supplierId !== null)
      throw unprocessable('/body/supplierId', `only a supplier-admin is bound to a supplier, not a ${role}`);
    return;
  }
  if (supplierId === null) throw unprocessable('/body/supplierId', 'a supplier-admin needs the supplier it manages');
  if (!(await Supplier.findByPk(supplierId, { transaction })))
    throw unprocessable('/body/supplierId', `there is no supplier ${supplierId}`);
}

function toInvitationSummary(invitation: Invitation): InvitationSummary {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    supplierId: invitation.supplierId ?? null,
    createdAt: invitation.createdAt.toISOString(),
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

/** Site admin work: accounts, roles, invitations, the audit log and the demo mailbox. */
export function createAdminHandlers(
  sequelize: Sequelize,
  dependencies: AccountsDependencies,
): Record<string, RequestHandler> {
  return {
    listUsers: async (_request, response) => {
      const [users, suppliers] = await Promise.all([
        User.findAll({ order: [['email', 'ASC']] }),
        Supplier.findAll({ order: [['name', 'ASC']], attributes: ['id', 'code', 'name'] }),
      ]);
      response.json({
        users: users.map(toAdminUser),
        suppliers: suppliers.map(({ id, code, name }) => ({ id, code, name })),
      });
    },

    updateUser: async (request, response) => {
      const admin = currentUser(request);
      const userId = Number(request.params.userId);
      const changes = request.body as UserChanges;
      const updated = await sequelize.transaction(async (transaction) => {
        const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
        if (!user)
          throw new ProblemError(404, 'Not found', `There is no user ${userId}`, [
            { pointer: '/path/userId', detail: 'is not a user' },
          ]);
        const role = changes.role ?? user.role;
        // Leaving the supplier-admin role drops the supplier unless the request names one.
        const supplierId =
          changes.supplierId !== undefined
            ? changes.supplierId
            : role === 'supplier-admin'
              ? (user.supplierId ?? null)
              : null;
        const disabled = changes.disabled ?? user.disabled;
        if (user.id === admin.id && role !== 'admin')
          throw unprocessable('/body/role', 'you cannot take the admin role from yourself');
        if (user.id === admin.id && disabled)
          throw unprocessable('/body/disabled', 'you cannot disable your own account');
        await checkSupplierBinding(role, supplierId, transaction);

        const events: AuditEntry[] = [];
        const about = { actorUserId: admin.id, subjectUserId: user.id, email: user.email };
        if (role !== user.role) events.push({ ...about, action: 'role-changed', detail: `${user.role} -> ${role}` });
        if (supplierId !== (user.supplierId ?? null))
          events.push({
            ...about,
            action: 'supplier-changed',
            detail: `${user.supplierId ?? 'none'} -> ${supplierId ?? 'none'}`,
          });
        if (disabled !== user.disabled) events.push({ ...about, action: disabled ? 'user-disabled' : 'user-enabled' });
        await user.update(
          {
            name: changes.name === undefined ? user.name : checkedName(changes.name, '/body/name'),
            role,
            supplierId,
            disabled,
          },
          { transaction },
        );
        if (disabled) await revokeAllSessions(user.id, transaction);
        for (const event of events) await recordAuditEvent(request, event, transaction);
        return user;
      });
      response.json(toAdminUser(updated));
    },

    listInvitations: async (_request, response) => {
      const invitations = await Invitation.findAll({
        where: { acceptedAt: null },
        order: [
          ['createdAt', 'DESC'],
          ['id', 'DESC'],
        ],
        limit: 200,
      });
      response.json({ invitations: invitations.map(toInvitationSummary) });
    },

    inviteUser: async (request, response) => {
      const admin = currentUser(request);
      const body = request.body as NewInvitation;
      const email = normaliseEmail(body.email);
      const supplierId = body.supplierId ?? null;
      await checkSupplierBinding(body.role, supplierId);
      if (await User.count({ where: { email } })) {
        throw new ProblemError(
          409,
          'Account exists',
          `${email} already has an account`,
          [{ pointer: '/body/email', detail: 'already has an account' }],
          'account-exists',
        );
      }
      const { token, hash } = newSecretToken('emailLink');
      const now = new Date();
      const invitation = await sequelize.transaction(async (transaction) => {
        // Only the newest invitation to an address works.
        await Invitation.update(
          { expiresAt: now },
          { where: { email, acceptedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
        );
        const created = await Invitation.create(
          {
            email,
            role: body.role,
            supplierId,
            invitedByUserId: admin.id,
            tokenHash: hash,
            expiresAt: new Date(now.getTime() + lifetimes.invitationMs),
          },
          { transaction },
        );
        await recordAuditEvent(
          request,
          { action: 'invitation-sent', actorUserId: admin.id, email, detail: `role ${body.role}` },
          transaction,
        );
        try {
          await dependencies.mailer.send(
            invitationMessage({
              to: email,
              role: body.role,
              invitedBy: admin.name,
              link: `${dependencies.publicUrl}/accounts/accept-invitation?token=${token}`,
              validForMs: lifetimes.invitationMs,
            }),
          );
        } catch (error) {
          request.log.error({ err: error }, 'invitation not sent');
          throw new ProblemError(
            503,
            'Mail not sent',
            'The invitation could not be e-mailed; nothing was saved. Try again later',
            [],
            'mail-not-sent',
          );
        }
        return created;
      });
      response.status(201).json(toInvitationSummary(invitation));
    },

    listAuditEvents: async (request, response) => {
      const { limit = 100, before } = request.query as AuditEventsQuery;
      const events = await AuditEvent.findAll({
        where: before ? { id: { [Op.lt]: before } } : {},
        include: [
          { model: User, as: 'actor', attributes: ['email'] },
          { model: User, as: 'subject', attributes: ['email'] },
        ],
        order: [['id', 'DESC']],
        limit,
      });
      const views: AuditEventView[] = events.map((event) => ({
        id: Number(event.id),
        at: event.createdAt.toISOString(),
        action: event.action,
        actorEmail: event.actor?.email ?? null,
        subjectEmail: event.subject?.email ?? null,
        email: event.email,
        ip: event.ip,
        detail: event.detail,
      }));
      response.json({ events: views });
    },

    listDemoMail: async (_request, response) => {
      if (!dependencies.demoMailboxFolder)
        throw new ProblemError(
          404,
          'Not found',
          'The demo mailbox exists only in demo mode with the built-in mail server',
        );
      response
        .set('Cache-Control', 'no-store')
        .json({ messages: readMailbox(dependencies.demoMailboxFolder).slice(0, 200) });
    },
  };
}
