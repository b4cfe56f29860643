import type { Request, RequestHandler, Response } from 'express';
import { hashSecretToken, secretTokenKindOf } from '../accounts/secret-tokens';
import { ProblemError } from '../api/problem-details';
import { ClientLink, ClientLinkView, CompanyProfile, Project, ProjectReport } from '../database/models';
import { clientLinkState } from './client-link-handlers';
import { clientViewPage, clientViewProblemPage } from './client-view-page';
import { proposalFileName } from './stored-reports';

/*
 * What a client link opens, without an account: the proposal's page and its PDF, nothing else.
 * The token is looked up by its SHA-256 only when it has the client-link form. Answers are not
 * cached, and the site's no-referrer policy keeps the token out of other sites' logs.
 */

interface OpenLink {
  link: ClientLink;
  project: Project;
  report: ProjectReport;
}

function unknownLink(): ProblemError {
  return new ProblemError(
    404,
    'Link not found',
    'This link does not open any proposal; ask the designer who sent it for a new one.',
    [{ pointer: '/query/token', detail: 'is not a client link' }],
    'client-link-unknown',
  );
}

async function openLink(request: Request): Promise<OpenLink> {
  const token = String(request.query.token ?? '');
  if (secretTokenKindOf(token) !== 'clientLink') throw unknownLink();
  const link = await ClientLink.findOne({ where: { tokenHash: hashSecretToken(token) } });
  if (!link) throw unknownLink();
  const state = clientLinkState(link);
  if (state !== 'active')
    throw new ProblemError(
      410,
      'Link no longer open',
      state === 'revoked'
        ? 'This link was withdrawn by the designer; ask them for a new one.'
        : 'This link has expired; ask the designer who sent it for a new one.',
      [{ pointer: '/query/token', detail: state === 'revoked' ? 'was revoked' : 'has expired' }],
      'client-link-gone',
    );
  const [project, report] = await Promise.all([
    Project.findByPk(link.projectId),
    ProjectReport.findByPk(link.reportId),
  ]);
  // the rows cascade with the link, so this is a race with a deletion
  if (!project || !report) throw unknownLink();
  await ClientLinkView.create({
    linkId: link.id,
    what: request.path.endsWith('.pdf') ? 'pdf' : 'page',
    viewedAt: new Date(),
  });
  return { link, project, report };
}

/** Browsers (asking for HTML first) see a short page for a refused link; other callers problem details. */
function answeredAsPage(error: unknown, request: Request, response: Response): boolean {
  if (!(error instanceof ProblemError) || (error.status !== 404 && error.status !== 410)) return false;
  if (request.accepts(['application/problem+json', 'application/json', 'text/html']) !== 'text/html') return false;
  response.status(error.status).type('html').send(clientViewProblemPage(error.title, error.detail));
  return true;
}

/** A handler that answers only for an open link; refused links as a page or problem details. */
function forOpenLink(
  answer: (open: OpenLink, request: Request, response: Response) => Promise<void> | void,
): RequestHandler {
  return async (request, response) => {
    response.set('Cache-Control', 'no-store');
    let open: OpenLink;
    try {
      open = await openLink(request);
    } catch (error) {
      if (answeredAsPage(error, request, response)) return;
      throw error;
    }
    await answer(open, request, response);
  };
}

export function createClientViewHandlers(): Record<'getClientView' | 'getClientViewPdf', RequestHandler> {
  return {
    getClientView: forOpenLink(async ({ project, report }, request, response) => {
      // the profile names the company of a proposal made before its facts were kept
      const profile = report.facts ? null : await CompanyProfile.findByPk(project.ownerUserId);
      response.type('html').send(
        clientViewPage({
          projectName: report.facts?.projectName ?? project.name,
          facts: report.facts,
          companyName: profile?.name ?? '',
          madeAt: report.createdAt,
          pdfHref: `/api/v1/client-view/report.pdf?token=${encodeURIComponent(String(request.query.token))}`,
        }),
      );
    }),

    getClientViewPdf: forOpenLink(({ project, report }, _request, response) => {
      response
        .type('application/pdf')
        .set('Content-Disposition', `inline; filename="${proposalFileName(project, report)}"`)
        .set('Repr-Digest', `sha-256=:${Buffer.from(report.sha256, 'hex').toString('base64')}:`)
        .send(report.pdf);
    }),
  };
}
