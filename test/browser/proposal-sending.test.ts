import { createHash } from 'node:crypto';
import { expect } from 'chai';
import { demoAccounts, demoPassword } from '../../server/accounts/demo-accounts';
import { ProjectReport, ProposalMail } from '../../server/database/models';
import { axeViolations, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { openBrowser, saveScreenshot, type BrowserSession } from '../support/browser';

/**
 * The demo designer sends a saved project's proposal: records the client, makes the PDF, e-mails
 * it (the demo admin finds it in the demo mailbox with its attachment), makes a client link that a
 * fresh browser opens without signing in, then revokes it and the link answers 410.
 */
describe('sending a proposal to the client in Chromium', function () {
  this.timeout(180_000);
  const app = useAppInChromium();
  const designer = demoAccounts.find((account) => account.role === 'designer')!;
  const admin = demoAccounts.find((account) => account.role === 'admin')!;
  const projectName = `Brookside rill ${process.pid}`;
  const clientEmail = `rowan-${process.pid}-${Date.now()}@client.test`;
  const others: BrowserSession[] = [];
  let linkPath = '';

  after(async () => {
    for (const other of others) await other.close();
  });

  async function signIn(session: BrowserSession, email: string, returnTo: string): Promise<void> {
    const { page } = session;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=${encodeURIComponent(returnTo)}`, {
      waitUntil: 'networkidle',
    });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(demoPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === returnTo);
  }

  it('records the client, makes the proposal and e-mails it from the project', async () => {
    const { page } = app;
    await signIn(app.browser, designer.email, '/design/system');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByLabel('Project name').fill(projectName);
    await page.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
    await page.locator('.rf-save-note', { hasText: `Saved as "${projectName}"` }).waitFor();

    await page.goto(`${app.url}/design/projects`, { waitUntil: 'networkidle' });
    await page.getByRole('link', { name: `Send the proposal of ${projectName}` }).click();
    await page.getByRole('heading', { name: `Send the proposal: ${projectName}` }).waitFor();
    await page.getByLabel('Client name').fill('Rowan Ashby');
    await page.getByLabel('Client e-mail').fill(clientEmail);
    await page.getByLabel('Site address (optional)').fill('12 Mill Lane, Eastbrook');
    await page.getByRole('button', { name: 'Save client and site' }).click();
    await page.getByRole('status').filter({ hasText: 'The client and site are saved.' }).waitFor();

    await page.getByRole('button', { name: 'Make a new proposal' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: /Proposal \d+ is made and stored/ })
      .waitFor();
    await page
      .getByLabel('Message to the client')
      .fill('Dear Rowan,\n\nthe rill proposal is attached.\n\nDemo Designer');
    await page.getByRole('button', { name: 'Send to the client' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Sent to ${clientEmail}` })
      .waitFor();
    await page.getByRole('table', { name: 'Sent proposals' }).getByRole('cell', { name: clientEmail }).waitFor();
    const logged = await ProposalMail.findOne({ where: { toAddress: clientEmail } });
    expect(logged?.subject).to.match(new RegExp(`^Proposal: ${projectName}`));

    expect(seriousOrCritical(await axeViolations(page))).to.deep.equal([]);
  });

  it('shows the message in the demo mailbox with its PDF attachment', async () => {
    const mailbox = await openBrowser();
    others.push(mailbox);
    await signIn(mailbox, admin.email, '/admin/demo-mailbox');
    const panel = mailbox.page.locator('mat-expansion-panel', { hasText: clientEmail }).first();
    await panel.waitFor();
    // the newest message opens expanded; another is opened by its header
    const header = panel.locator('mat-expansion-panel-header');
    if ((await header.getAttribute('aria-expanded')) !== 'true') await header.click();
    const attachments = panel.getByRole('list', { name: 'Attachments' });
    await attachments.waitFor();
    const stored = await ProjectReport.findOne({ order: [['id', 'DESC']] });
    const text = await attachments.innerText();
    expect(text).to.match(/proposal-brookside-rill-\d+-\d{4}-\d{2}-\d{2}\.pdf/);
    expect(text).to.include('application/pdf');
    expect(text).to.include(`${(stored!.byteLength / 1024).toFixed(1)} KiB`);
    expect(text).to.include(stored!.sha256.slice(0, 12));
    await saveScreenshot(mailbox.page, 'proposal-in-demo-mailbox');
  });

  it('makes a client link that a fresh browser opens without signing in', async () => {
    const { page } = app;
    await page.getByRole('button', { name: 'Make a client link' }).click();
    const field = page.getByLabel('Client link (shown once)');
    await field.waitFor();
    const url = new URL(await field.inputValue());
    expect(url.pathname).to.equal('/api/v1/client-view');
    expect(url.searchParams.get('token')).to.match(/^rfc_[A-Za-z0-9_-]{43}$/);
    // the link names the configured public address; this test's server listens on a port of its own
    linkPath = `${url.pathname}${url.search}`;
    await page.getByRole('button', { name: 'Copy the link' }).click();
    await page.getByRole('table', { name: 'Client links' }).getByRole('cell', { name: 'Open', exact: true }).waitFor();
    await saveScreenshot(page, 'proposal-sending');

    const client = await openBrowser();
    others.push(client);
    const answer = await client.page.goto(`${app.url}${linkPath}`, { waitUntil: 'load' });
    expect(answer?.status()).to.equal(200);
    await client.page.getByRole('heading', { name: `Pump proposal: ${projectName}` }).waitFor();
    const body = await client.page.locator('body').innerText();
    expect(body).to.include('Rowan Ashby').and.to.include('12 Mill Lane, Eastbrook');
    expect(body).to.include('Chosen pump').and.to.include('Electricity near water.');
    const pdfHref = await client.page.getByRole('link', { name: 'Open the proposal (PDF)' }).getAttribute('href');
    const pdf = await client.context.request.get(`${app.url}${pdfHref}`);
    expect(pdf.status()).to.equal(200);
    const stored = await ProjectReport.findOne({ order: [['id', 'DESC']] });
    expect(
      createHash('sha256')
        .update(await pdf.body())
        .digest('hex'),
    ).to.equal(stored!.sha256);
    expect(seriousOrCritical(await axeViolations(client.page))).to.deep.equal([]);
    await saveScreenshot(client.page, 'client-view');
    expect(client.offLoopbackRequests).to.deep.equal([]);

    await page.reload({ waitUntil: 'networkidle' });
    const row = page.getByRole('table', { name: 'Client links' }).getByRole('row').nth(1);
    expect(await row.innerText()).to.match(/Open\s+2\s/);
  });

  it('revokes the link; it then answers 410 with a page saying so', async () => {
    const { page } = app;
    await page
      .getByRole('button', { name: /^Revoke link \d+$/ })
      .first()
      .click();
    await page.getByRole('table', { name: 'Client links' }).getByRole('cell', { name: 'Revoked' }).waitFor();
    const client = others[1];
    const answer = await client.page.goto(`${app.url}${linkPath}`, { waitUntil: 'load' });
    expect(answer?.status()).to.equal(410);
    await client.page.getByRole('heading', { name: 'Link no longer open' }).waitFor();
    expect(await client.page.locator('body').innerText()).to.include('withdrawn by the designer');
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
