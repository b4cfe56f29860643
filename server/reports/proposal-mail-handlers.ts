import type { RequestHandler } from 'express';
import type {
  ProposalMail as ProposalMailView,
  ProposalMailList,
  ProposalMailRequest,
} from '../../shared/api/api-schemas';
import { currentUser } from '../accounts/authenticated-user';
import { ProblemError } from '../api/problem-details';
import { CompanyProfile, ProposalMail, User } from '../database/models';
import type { Mailer } from '../mail/mailer';
import { ownProject } from '../projects/project-handlers';
import { optionalText } from './profile-handlers';
import { proposalFileName, storedReportOf } from './stored-reports';

/*
 * A stored proposal e-mailed to the project's client, the PDF attached as it was made. The send is
 * logged only once the SMTP server has taken the message, so the log never lists one that was
 * not sent.
 */

/** The designer's message: lines under the shared text rule, blank lines kept, something visible in all. */
function checkedMessage(text: string): string {
  const message = optionalText(text.replace(/\r\n?/g, '\n'), '/body/message');
  if (message === '')
    throw new ProblemError(422, 'Invalid message', '/body/message must contain something visible', [
      { pointer: '/body/message', detail: 'must contain something visible' },
    ]);
  return message;
}

async function mailView(mail: ProposalMail): Promise<ProposalMailView> {
  const sender = mail.sentByUserId === null ? null : await User.findByPk(mail.sentByUserId);
  return {
    id: mail.id,
    reportId: mail.reportId,
    to: mail.toAddress,
    subject: mail.subject,
    sentBy: sender ? { id: sender.id, name: sender.name } : null,
    sentAt: mail.sentAt.toISOString(),
    messageId: mail.messageId,
  };
}

export function createProposalMailHandlers(
  mailer: Mailer,
): Record<'sendProposalMail' | 'listProposalMails', RequestHandler> {
  return {
    sendProposalMail: async (request, response) => {
      const body = request.body as ProposalMailRequest;
      const text = checkedMessage(body.message);
      const project = await ownProject(request);
      const report = await storedReportOf(project, body.reportId, '/body/reportId');
      const to = body.to?.trim() || project.clientEmail;
      if (!to)
        throw new ProblemError(
          422,
          'No recipient',
          'the project has no client e-mail; record one or name `to`',
          [{ pointer: '/body/to', detail: 'is needed when the project has no client e-mail' }],
          'no-recipient',
        );
      const profile = await CompanyProfile.findByPk(project.ownerUserId);
      const subject = `Proposal: ${project.name}${profile?.name ? ` (${profile.name})` : ''}`;
      const filename = proposalFileName(project, report);
      let messageId: string;
      try {
        ({ messageId } = await mailer.send({
          to,
          subject,
          text,
          attachments: [{ filename, contentType: 'application/pdf', content: report.pdf }],
        }));
      } catch (error) {
        throw new ProblemError(
          503,
          'Mail not sent',
          `the mail server did not take the message (${String((error as Error).message).slice(0, 200)}); nothing was sent, try again later`,
          [],
          'mail-not-sent',
        );
      }
      const mail = await ProposalMail.create({
        projectId: project.id,
        reportId: report.id,
        toAddress: to,
        subject,
        sentByUserId: currentUser(request).id,
        messageId,
        sentAt: new Date(),
      });
      response.status(201).json({ ...(await mailView(mail)), attachment: { filename, byteLength: report.byteLength } });
    },

    listProposalMails: async (request, response) => {
      const project = await ownProject(request);
      const mails = await ProposalMail.findAll({
        where: { projectId: project.id },
        order: [
          ['sentAt', 'DESC'],
          ['id', 'DESC'],
        ],
      });
      const answer: ProposalMailList = { mails: await Promise.all(mails.map(mailView)) };
      response.json(answer);
    },
  };
}
