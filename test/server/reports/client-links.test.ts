import { createHash } from 'node:crypto';
import { expect } from 'chai';
import request from 'supertest';
import type {
  ClientLinkList,
  CreatedClientLink,
  Project,
  ReportSummary,
  SelectionResponse,
} from '../../../shared/api/api-schemas';
import { designSelectionRequest } from '../../../shared/api/design-system';
import { DESIGN_CAUTIONS } from '../../../shared/messages/design-cautions';
import { newSecretToken } from '../../../server/accounts/secret-tokens';
import { ClientLink, ClientLinkView, Project as ProjectRow } from '../../../server/database/models';
import { binary, expectConforms, projectExample, useSendingFixture } from './sending-fixture';

/*
 * Read-only client links to a stored proposal: made with a token answered once and stored hashed,
 * their page and PDF opened without an account and each opening logged, 404 for an unknown token,
 * 410 once expired or revoked, a limit per client address, and a token that opens nothing else.
 */
describe('client links: a stored proposal for the client, read-only', function () {
  this.timeout(120_000);
  const fixture = useSendingFixture('client_links');
  const { as } = fixture;
  const appWith: typeof fixture.appWith = (accounts) => fixture.appWith(accounts);
  let app: typeof fixture.app;
  let designerToken: string;
  let otherToken: string;
  let project: Project;
  let report: ReportSummary;

  before(async () => {
    ({ app, designerToken, otherToken, project } = fixture);
    await as(designerToken)
      .put(`/projects/${project.id}/client`, {
        clientName: 'Ada Moss',
        clientEmail: 'ada.moss@client.test',
        siteAddress: '4 Orchard Row\nFairview',
      })
      .expect(200);
    report = (await as(designerToken).post(`/projects/${project.id}/reports`, { paper: 'a4' }).expect(201))
      .body as ReportSummary;
  });

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
