import type { RequestHandler } from 'express';
import { fn, col } from 'sequelize';
import type {
  ClientLink as ClientLinkView,
  ClientLinkList,
  ClientLinkRequest,
  ClientLinkState,
  CreatedClientLink,
} from '../../shared/api/api-schemas';
import { currentUser } from '../accounts/authenticated-user';
import { newSecretToken } from '../accounts/secret-tokens';
import { ProblemError } from '../api/problem-details';
import { ClientLink, ClientLinkView as ClientLinkOpening } from '../database/models';
import { ownProject } from '../projects/project-handlers';
import { storedReportOf } from './stored-reports';

/*
 * Read-only links a designer hands a client: each opens one stored proposal (its page and PDF,
 * `client-view-handlers.ts`) until it expires or is revoked. The token is answered once and kept
 * only as its SHA-256.
 */

const dayMs = 86_400_000;
const defaultExpiryDays = 30;

export function clientLinkState(link: ClientLink, now = new Date()): ClientLinkState {
  if (link.revokedAt) return 'revoked';
  return link.expiresAt.getTime() <= now.getTime() ? 'expired' : 'active';
}

interface Openings {
  count: number;
  last: Date | null;
}

async function openingsOf(linkIds: number[]): Promise<Map<number, Openings>> {
  if (linkIds.length === 0) return new Map();
  const rows = (await ClientLinkOpening.findAll({
    attributes: ['linkId', [fn('COUNT', col('id')), 'count'], [fn('MAX', col('viewed_at')), 'last']],
    where: { linkId: linkIds },
    group: ['linkId'],
    raw: true,
  })) as unknown as Array<{ linkId: number; count: number | string; last: Date | string | null }>;
  return new Map(
    rows.map((row) => [row.linkId, { count: Number(row.count), last: row.last === null ? null : new Date(row.last) }]),
  );
}

function linkView(link: ClientLink, openings: Openings = { count: 0, last: null }): ClientLinkView {
  return {
    id: link.id,
    reportId: link.reportId,
    createdAt: link.createdAt.toISOString(),
    expiresAt: link.expiresAt.toISOString(),
    revokedAt: link.revokedAt ? link.revokedAt.toISOString() : null,
    state: clientLinkState(link),
    viewCount: openings.count,
    lastViewedAt: openings.last ? openings.last.toISOString() : null,
  };
}

export function createClientLinkHandlers(
  publicUrl: string,
): Record<'createClientLink' | 'listClientLinks' | 'revokeClientLink', RequestHandler> {
  return {
    createClientLink: async (request, response) => {
      const body = request.body as ClientLinkRequest;
      const project = await ownProject(request);
      const report = await storedReportOf(project, body.reportId, '/body/reportId');
      const secret = newSecretToken('clientLink');
      const link = await ClientLink.create({
        projectId: project.id,
        reportId: report.id,
        tokenHash: secret.hash,
        createdByUserId: currentUser(request).id,
        expiresAt: new Date(Date.now() + (body.expiresInDays ?? defaultExpiryDays) * dayMs),
      });
      const answer: CreatedClientLink = {
        ...linkView(link),
        token: secret.token,
        url: `${publicUrl}/api/v1/client-view?token=${secret.token}`,
      };
      response.status(201).json(answer);
    },

    listClientLinks: async (request, response) => {
      const project = await ownProject(request);
      const links = await ClientLink.findAll({
        where: { projectId: project.id },
        order: [
          ['createdAt', 'DESC'],
          ['id', 'DESC'],
        ],
      });
      const openings = await openingsOf(links.map((link) => link.id));
      const answer: ClientLinkList = { links: links.map((link) => linkView(link, openings.get(link.id))) };
      response.json(answer);
    },

    revokeClientLink: async (request, response) => {
      const project = await ownProject(request);
      const linkId = Number(request.params.linkId);
      const link = await ClientLink.findOne({ where: { id: linkId, projectId: project.id } });
      if (!link)
        throw new ProblemError(404, 'Not found', `Project ${project.id} has no client link ${linkId}`, [
          { pointer: '/path/linkId', detail: 'is not a client link of this project' },
        ]);
      if (!link.revokedAt) await link.update({ revokedAt: new Date() });
      response.status(204).end();
    },
  };
}
