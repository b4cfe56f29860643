import { expect } from 'chai';
import type { Project, ProposalMail, ProposalMailList, ReportSummary } from '../../../shared/api/api-schemas';
import { loadConfig } from '../../../server/config';
import { ProposalMail as ProposalMailRow } from '../../../server/database/models';
import { createSmtpMailer } from '../../../server/mail/mailer';
import { tableChecksums, waitForMail } from '../../support/accounts';
import { freeLoopbackPort } from '../../support/free-port';
import { readPdf } from './pdf-text';
import { binary, expectConforms, projectExample, useSendingFixture } from './sending-fixture';

/*
 * A stored proposal e-mailed to its client: the client and site on the project, the PDF sent
 * through the fake SMTP server (read back there with mailparser, its bytes' checksum the stored
 * one's), the send log, and what is refused: no recipient, a bad message, SMTP down, too many.
 */
describe('proposal mails: the client and site, the PDF e-mailed, the send log', function () {
  this.timeout(120_000);
  const fixture = useSendingFixture('proposal_mails');
  const { as } = fixture;
  const appWith: typeof fixture.appWith = (accounts) => fixture.appWith(accounts);
  let designerToken: string;
  let otherToken: string;
  let project: Project;
  let report: ReportSummary;
  const clientEmail = `ada-${process.pid}-${Date.now()}@client.test`;

  before(() => {
    ({ designerToken, otherToken, project } = fixture);
  });

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
    const before = await tableChecksums(fixture.sequelize, ['sessions']);
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
    expect(await tableChecksums(fixture.sequelize, ['sessions'])).to.deep.equal(before);
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
});
