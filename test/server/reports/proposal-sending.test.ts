import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { OpenAPIV3_1 } from 'openapi-types';
import request from 'supertest';
import type {
  ClientLinkList,
  CreatedClientLink,
  Project,
  ProjectInput,
  ProposalMail,
  ProposalMailList,
  ReportSummary,
  SelectionResponse,
} from '../../../shared/api/api-schemas';
import { designSelectionRequest } from '../../../shared/api/design-system';
import { DESIGN_CAUTIONS } from '../../../shared/messages/design-cautions';
import { newSecretToken } from '../../../server/accounts/secret-tokens';
import { openApiDocument } from '../../../server/api/openapi-document';
import { createApp } from '../../../server/app';
import { loadConfig } from '../../../server/config';
import {
  ClientLink,
  ClientLinkView,
  Project as ProjectRow,
  ProposalMail as ProposalMailRow,
} from '../../../server/database/models';
import { createLogger } from '../../../server/logging';
import { createSmtpMailer } from '../../../server/mail/mailer';
import { createUserWithSession, tableChecksums, testMailboxFolder, waitForMail } from '../../support/accounts';
import { contractSchemaValidator } from '../../support/contract-validator';
import { freeLoopbackPort } from '../../support/free-port';
import { createScratchDatabase } from '../../support/test-database';
import { seedSyntheticCatalog, syntheticShapes } from '../selection/synthetic-catalog';
import { binaryBody, readPdf } from './pdf-text';

/*
 * A stored proposal sent to its client: the client and site on the project, the PDF e-mailed
 * through the fake SMTP server (read back with mailparser, its bytes' checksum the stored one's),
 * and the read-only client link with its page, PDF, views, expiry and revocation.
 */

/** The answer matches the contract's schema of that name. */
function expectConforms(schema: string, body: unknown): void {
  const validate = contractSchemaValidator(schema);
  expect(validate(body), `${schema}: ${JSON.stringify(validate.errors)}`).to.equal(true);
}

function projectExample(): ProjectInput {
  const operation = (openApiDocument.paths?.['/projects'] as OpenAPIV3_1.PathItemObject)
    .post as OpenAPIV3_1.OperationObject;
  return structuredClone(
    (operation.requestBody as OpenAPIV3_1.RequestBodyObject).content['application/json'].example as ProjectInput,
  );
}

describe('sending a proposal: client and site, e-mail with the PDF, read-only client links', function () {
  this.timeout(120_000);
  let scratch: Awaited<ReturnType<typeof createScratchDatabase>>;
  let app: ReturnType<typeof createApp>;
  let designerToken: string;
  let otherToken: string;
  let project: Project;
  let report: ReportSummary;
  const generous = { limit: 10_000, windowMs: 60_000 };
  const clientEmail = `ada-${process.pid}-${Date.now()}@client.test`;

  const appWith = (accounts: Parameters<typeof createApp>[0]['accounts']) =>
    createApp({ sequelize: scratch.sequelize, logger: createLogger('silent'), accounts });

  before(async () => {
    scratch = await createScratchDatabase('proposal_sending');
    await seedSyntheticCatalog(scratch.sequelize, syntheticShapes(120, 7));
    app = appWith({
      publicUrl: 'http://riffle.example.test',
      demoMailboxFolder: testMailboxFolder(),
      rateLimits: { 'proposal-mail': generous, 'client-link': generous },
    });
    designerToken = (await createUserWithSession(scratch.sequelize, 'designer', { name: 'Jo Fenwick' })).token;
    otherToken = (await createUserWithSession(scratch.sequelize, 'designer')).token;
    project = (await as(designerToken).post('/projects', projectExample()).expect(201)).body as Project;
    await as(designerToken)
      .put('/account/profile', { name: 'Millrace Pond Works', address: '', phone: '', email: '', licenceNumber: '' })
      .expect(200);
  });

  after(async () => {
    await scratch?.drop();
  });

  function as(token: string, target = () => app) {
    const auth = (pending: request.Test) => pending.set('Authorization', `Bearer ${token}`);
    return {
      get: (path: string) => auth(request(target()).get(`/api/v1${path}`)),
      post: (path: string, body: object) => auth(request(target()).post(`/api/v1${path}`)).send(body),
      put: (path: string, body: object) => auth(request(target()).put(`/api/v1${path}`)).send(body),
      delete: (path: string) => auth(request(target()).delete(`/api/v1${path}`)),
    };
  }

  const binary = (pending: request.Test) => pending.buffer(true).parse(binaryBody as never);

  it('records the client and site on the project and answers them in its GET', async () => {
    const fresh = (await as(designerToken).get(`/projects/${project.id}`).expect(200)).body as Project;
    expect(fresh.client).to.deep.equal({ clientName: null, clientEmail: null, clientPhone: null, siteAddress: null });
    const saved = await as(designerToken)
      .put(`/projects/${project.id}/client`, {
        clientName: ' Ada Moss ',
        clientEmail,
        clientPhone: '+1 555 0142',
        siteAddress: '4 Orchard Row\nFairview',
      })
      .expect(200);
    expect(saved.body).to.deep.equal({
      clientName: 'Ada Moss',
      clientEmail,
      clientPhone: '+1 555 0142',
      siteAddress: '4 Orchard Row\nFairview',
    });
    const read = (await as(designerToken).get(`/projects/${project.id}`).expect(200)).body as Project;
    expect(read.client).to.deep.equal(saved.body);
    expectConforms('ProjectClient', saved.body);
    expectConforms('Project', read);
  });

  it('refuses a bad client e-mail, phone or name with a 4xx naming the field and writes nothing', async () => {
    const before = await tableChecksums(scratch.sequelize, ['sessions']);
    const good = { clientName: 'Ada Moss', clientEmail };
    const cases: Array<[object, number, string]> = [
      [{ ...good, clientEmail: 'not-an-address' }, 400, '/body/clientEmail'],
      [{ ...good, clientPhone: 'call me' }, 400, '/body/clientPhone'],
      [{ ...good, clientName: 'Ada \u202EssoM' }, 422, '/body/clientName'],
      [{ ...good, siteAddress: 'Row 4\n\u202Eweiv' }, 422, '/body/siteAddress'],
    ];
    for (const [body, status, pointer] of cases) {
      const answer = await as(designerToken).put(`/projects/${project.id}/client`, body).expect(status);
      expect(answer.type).to.equal('application/problem+json');
      expect(JSON.stringify(answer.body.errors)).to.contain(pointer);
    }
    await as(otherToken).put(`/projects/${project.id}/client`, good).expect(404);
    expect(await tableChecksums(scratch.sequelize, ['sessions'])).to.deep.equal(before);
  });

  it("prints the project's client, contact and site on a proposal made after they are recorded", async () => {
    report = (await as(designerToken).post(`/projects/${project.id}/reports`, { paper: 'a4' }).expect(201))
      .body as ReportSummary;
    const pdf = await binary(as(designerToken).get(report.downloadPath.replace('/api/v1', ''))).expect(200);
    const text = (await readPdf(pdf.body as Buffer)).pages.join(' ');
    expect(text).to.include('Ada Moss').and.to.include(clientEmail).and.to.include('+1 555 0142');
    expect(text).to.include('4 Orchard Row');
  });

  it('e-mails the stored PDF to the client; the message arrives with the same bytes attached and is logged', async () => {
    const since = new Date(Date.now() - 1000);
    const message = 'Dear Ada,\n\nthe proposal for the cascade is attached.\n\nKind regards,\nJo';
    const sent = (
      await as(designerToken)
        .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message })
        .expect(201)
    ).body as ProposalMail;
    expectConforms('ProposalMail', sent);
    expect(sent).to.include({ reportId: report.id, to: clientEmail });
    expect(sent.subject).to.equal(`Proposal: ${project.name} (Millrace Pond Works)`);
    expect(sent.sentBy?.name).to.equal('Jo Fenwick');
    const day = report.createdAt.slice(0, 10);
    expect(sent.attachment).to.deep.equal({
      filename: `proposal-hillside-cascade-${day}.pdf`,
      byteLength: report.byteLength,
    });

    const received = await waitForMail(clientEmail, since);
    expect(received.subject).to.equal(sent.subject);
    expect(received.text).to.equal(message);
    expect(received.attachments).to.have.length(1);
    expect(received.attachments[0]).to.deep.equal({
      filename: `proposal-hillside-cascade-${day}.pdf`,
      contentType: 'application/pdf',
      size: report.byteLength,
      sha256: report.sha256,
    });

    const log = (await as(designerToken).get(`/projects/${project.id}/proposal-mails`).expect(200))
      .body as ProposalMailList;
    expectConforms('ProposalMailList', log);
    expect(log.mails.map((mail) => mail.id)).to.deep.equal([sent.id]);
    expect(log.mails[0].messageId)
      .to.equal(sent.messageId)
      .and.to.match(/^<.+@.+>$/);
  });

  it('sends to `to` when given; without it and without a client e-mail answers 422 naming /body/to', async () => {
    const bare = (
      await as(designerToken)
        .post('/projects', { ...projectExample(), name: 'Bare pond' })
        .expect(201)
    ).body as Project;
    const bareReport = (await as(designerToken).post(`/projects/${bare.id}/reports`, { paper: 'letter' }).expect(201))
      .body as ReportSummary;
    const refused = await as(designerToken)
      .post(`/projects/${bare.id}/proposal-mails`, { reportId: bareReport.id, message: 'Here it is.' })
      .expect(422);
    expect(refused.body.errors[0].pointer).to.equal('/body/to');
    const elsewhere = `other-${process.pid}-${Date.now()}@client.test`;
    const since = new Date(Date.now() - 1000);
    await as(designerToken)
      .post(`/projects/${bare.id}/proposal-mails`, { reportId: bareReport.id, message: 'Here it is.', to: elsewhere })
      .expect(201);
    expect((await waitForMail(elsewhere, since)).attachments[0].sha256).to.equal(bareReport.sha256);
  });

  it("refuses another project's report, a bad message, and another designer's project, logging nothing", async () => {
    const before = await ProposalMailRow.count();
    const bad = await as(designerToken)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: 999_999, message: 'Hello' })
      .expect(422);
    expect(bad.body.errors[0].pointer).to.equal('/body/reportId');
    const bidi = await as(designerToken)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'Hello \u202Eevil' })
      .expect(422);
    expect(bidi.body.errors[0].pointer).to.equal('/body/message');
    await as(designerToken)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'x'.repeat(5001) })
      .expect(400);
    await as(otherToken)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'Hi' })
      .expect(404);
    await as(otherToken).get(`/projects/${project.id}/proposal-mails`).expect(404);
    expect(await ProposalMailRow.count()).to.equal(before);
  });

  it('answers 503 mail-not-sent when the SMTP server is down, and logs nothing as sent', async () => {
    const closedPort = await freeLoopbackPort();
    const down = appWith({ mailer: createSmtpMailer(loadConfig().mail, closedPort), rateLimits: {} });
    const before = await ProposalMailRow.count();
    const answer = await as(designerToken, () => down)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'Hello' })
      .expect(503);
    expect(answer.type).to.equal('application/problem+json');
    expect(answer.body.type).to.equal('/api/v1/problems/mail-not-sent');
    expect(await ProposalMailRow.count()).to.equal(before);
  });

  it('limits sends per user: past the limit 429, another user is not counted', async () => {
    const strict = appWith({ rateLimits: { 'proposal-mail': { limit: 1, windowMs: 60_000 } } });
    const designer = as(designerToken, () => strict);
    await designer.post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'One' }).expect(201);
    const limited = await designer
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'Two' })
      .expect(429);
    expect(limited.body.type).to.equal('/api/v1/problems/too-many-attempts');
    // the other designer's count is its own: the guard let it through to the 404 of a project not its own
    await as(otherToken, () => strict)
      .post(`/projects/${project.id}/proposal-mails`, { reportId: report.id, message: 'Mine' })
      .expect(404);
  });

  describe('client links', () => {
    let link: CreatedClientLink;
    const view = (token: string, path = '/client-view') => request(app).get(`/api/v1${path}`).query({ token });

    it('makes a link answered once with its token; only the SHA-256 is stored', async () => {
      link = (await as(designerToken).post(`/projects/${project.id}/client-links`, { reportId: report.id }).expect(201))
        .body as CreatedClientLink;
      expectConforms('CreatedClientLink', link);
      expect(link.token).to.match(/^rfc_[A-Za-z0-9_-]{43}$/);
      expect(link.url).to.equal(`http://riffle.example.test/api/v1/client-view?token=${link.token}`);
      expect(link).to.include({ reportId: report.id, state: 'active', viewCount: 0, lastViewedAt: null });
      const days = (Date.parse(link.expiresAt) - Date.parse(link.createdAt)) / 86_400_000;
      expect(days).to.be.closeTo(30, 0.01);
      const rows = JSON.stringify(await ClientLink.findAll({ raw: true }));
      expect(rows).not.to.contain(link.token);
      expect(rows).to.contain(createHash('sha256').update(link.token).digest('hex'));
      const listed = (await as(designerToken).get(`/projects/${project.id}/client-links`).expect(200))
        .body as ClientLinkList;
      expect(JSON.stringify(listed)).not.to.contain(link.token);
      const short = (
        await as(designerToken)
          .post(`/projects/${project.id}/client-links`, { reportId: report.id, expiresInDays: 2 })
          .expect(201)
      ).body as CreatedClientLink;
      expect((Date.parse(short.expiresAt) - Date.parse(short.createdAt)) / 86_400_000).to.be.closeTo(2, 0.01);
      await as(designerToken)
        .post(`/projects/${project.id}/client-links`, { reportId: report.id, expiresInDays: 366 })
        .expect(400);
      await as(otherToken).post(`/projects/${project.id}/client-links`, { reportId: report.id }).expect(404);
    });

    it("opens the proposal's page and its PDF without an account, and logs each view", async () => {
      const page = await view(link.token).expect(200);
      expect(page.type).to.equal('text/html');
      expect(page.headers['cache-control']).to.equal('no-store');
      expect(page.headers['content-security-policy']).to.contain("default-src 'self'");
      expect(page.text).to.include('Millrace Pond Works').and.to.include('Ada Moss').and.to.include('Fairview');
      expect(page.text).to.include('Hillside cascade');
      for (const caution of DESIGN_CAUTIONS) expect(page.text).to.include(caution.title);
      expect(page.text).not.to.match(/<script/i);
      // the chosen pump the page names is the selection search's first for the same design
      const search = (await as(designerToken).post('/selections', designSelectionRequest(project.design)).expect(200))
        .body as SelectionResponse;
      const first = search.candidates[0];
      expect(first, 'the synthetic catalog has a pump for the example design').not.to.equal(undefined);
      expect(page.text).to.include(`${first.supplier} ${first.model} (${first.modelCode})`);
      expect(page.text).to.include(
        `${first.operatingPoint.flow.toFixed(1)} gpm at ${first.operatingPoint.head.toFixed(2)} ft TDH`,
      );
      expect(page.text).to.include(`/api/v1/client-view/report.pdf?token=${link.token}`);

      const pdf = await binary(view(link.token, '/client-view/report.pdf')).expect(200);
      expect(pdf.headers['content-type']).to.match(/^application\/pdf/);
      expect(
        createHash('sha256')
          .update(pdf.body as Buffer)
          .digest('hex'),
      ).to.equal(report.sha256);

      const views = await ClientLinkView.findAll({ where: { linkId: link.id }, order: [['id', 'ASC']] });
      expect(views.map((row) => row.what)).to.deep.equal(['page', 'pdf']);
      const listed = (await as(designerToken).get(`/projects/${project.id}/client-links`).expect(200))
        .body as ClientLinkList;
      expectConforms('ClientLinkList', listed);
      const shown = listed.links.find((candidate) => candidate.id === link.id)!;
      expect(shown.viewCount).to.equal(2);
      expect(shown.lastViewedAt).to.equal(views[1].viewedAt.toISOString());
    });

    it('opens nothing else: not as a Bearer token, not as a cookie, not another project', async () => {
      for (const path of [
        '/projects',
        `/projects/${project.id}`,
        '/pumps',
        '/auth/me',
        `/projects/${project.id}/client-links`,
      ]) {
        const bearer = await request(app).get(`/api/v1${path}`).set('Authorization', `Bearer ${link.token}`);
        expect(bearer.status, path).to.equal(401);
        const cookie = await request(app)
          .get(`/api/v1${path}`)
          .set('Cookie', `token=${link.token}; session=${link.token}`);
        expect(cookie.status, path).to.equal(401);
      }
    });

    it('answers 404 for an unknown or malformed token and 410 once expired, both problem details', async () => {
      const unknown = await view(newSecretToken('clientLink').token).expect(404);
      expect(unknown.type).to.equal('application/problem+json');
      expect(unknown.body.type).to.equal('/api/v1/problems/client-link-unknown');
      await view('rfc_short').expect(404);
      await view(newSecretToken('session').token).expect(404);

      const expiring = (
        await as(designerToken).post(`/projects/${project.id}/client-links`, { reportId: report.id }).expect(201)
      ).body as CreatedClientLink;
      await ClientLink.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: expiring.id } });
      const viewsBefore = await ClientLinkView.count();
      const gone = await view(expiring.token).expect(410);
      expect(gone.type).to.equal('application/problem+json');
      expect(gone.body.errors[0]).to.deep.equal({ pointer: '/query/token', detail: 'has expired' });
      await binary(view(expiring.token, '/client-view/report.pdf')).expect(410);
      expect(await ClientLinkView.count()).to.equal(viewsBefore);
      const listed = (await as(designerToken).get(`/projects/${project.id}/client-links`).expect(200))
        .body as ClientLinkList;
      expect(listed.links.find((candidate) => candidate.id === expiring.id)?.state).to.equal('expired');
    });

    it('revokes a link: 204, then 410 (an HTML page for a browser), and the list says revoked', async () => {
      await as(otherToken).delete(`/projects/${project.id}/client-links/${link.id}`).expect(404);
      await view(link.token).expect(200);
      await as(designerToken).delete(`/projects/${project.id}/client-links/${link.id}`).expect(204);
      const gone = await view(link.token).expect(410);
      expect(gone.body.errors[0].detail).to.equal('was revoked');
      const page = await view(link.token).set('Accept', 'text/html,application/xhtml+xml,*/*;q=0.8').expect(410);
      expect(page.type).to.equal('text/html');
      expect(page.text).to.include('Link no longer open');
      await as(designerToken).delete(`/projects/${project.id}/client-links/${link.id}`).expect(204);
      await as(designerToken).delete(`/projects/${project.id}/client-links/999999`).expect(404);
      const listed = (await as(designerToken).get(`/projects/${project.id}/client-links`).expect(200))
        .body as ClientLinkList;
      const shown = listed.links.find((candidate) => candidate.id === link.id)!;
      expect(shown.state).to.equal('revoked');
      expect(shown.revokedAt).to.be.a('string');
    });

    it('limits openings per client address: past the limit 429', async () => {
      const strict = appWith({ rateLimits: { 'client-link': { limit: 3, windowMs: 60_000 } } });
      const fresh = (
        await as(designerToken).post(`/projects/${project.id}/client-links`, { reportId: report.id }).expect(201)
      ).body as CreatedClientLink;
      for (let attempt = 0; attempt < 3; attempt++)
        await request(strict).get('/api/v1/client-view').query({ token: fresh.token }).expect(200);
      const limited = await request(strict).get('/api/v1/client-view').query({ token: fresh.token }).expect(429);
      expect(limited.body.type).to.equal('/api/v1/problems/too-many-attempts');
      await request(strict)
        .get('/api/v1/client-view')
        .query({ token: newSecretToken('clientLink').token })
        .expect(429);
    });
  });

  it('keeps a deleted project from leaving mails or links behind', async () => {
    const victim = (
      await as(designerToken)
        .post('/projects', { ...projectExample(), name: 'Short-lived' })
        .expect(201)
    ).body as Project;
    const made = (await as(designerToken).post(`/projects/${victim.id}/reports`, { paper: 'a4' }).expect(201))
      .body as ReportSummary;
    const doomed = (
      await as(designerToken).post(`/projects/${victim.id}/client-links`, { reportId: made.id }).expect(201)
    ).body as CreatedClientLink;
    await as(designerToken).delete(`/projects/${victim.id}`).expect(204);
    expect(await ProjectRow.findByPk(victim.id)).to.equal(null);
    await request(app).get('/api/v1/client-view').query({ token: doomed.token }).expect(404);
  });
});
