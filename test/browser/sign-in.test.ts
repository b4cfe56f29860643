import { expect } from 'chai';
import type { Sequelize } from 'sequelize';
import { demoPassword } from '../../server/accounts/demo-accounts';
import { createSequelize } from '../../server/database/connection';
import { initialiseModels } from '../../server/database/models';
import { openBrowser, saveScreenshot, type BrowserSession } from '../support/browser';
import { testDatabaseConfig } from '../support/test-database';
import { startTestServer } from '../support/test-server';

/** The demo designer (seeded by `npm test` into its database) signs in, sees a designer's toolbar, and signs out. */
describe('signing in and out in Chromium', function () {
  this.timeout(90_000);
  let sequelize: Sequelize;
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;

  const navigationLabels = async () =>
    (await browser.page.locator('nav[aria-label="Main"] a').allInnerTexts()).map((text) => text.replace(/^\S+\s+/, '').trim());

  before(async () => {
    sequelize = createSequelize(testDatabaseConfig());
    initialiseModels(sequelize);
    server = await startTestServer(sequelize);
    browser = await openBrowser();
  });

  after(async () => {
    await browser?.close();
    await server?.close();
    await sequelize?.close();
  });

  it('sends a signed-out visitor from the account page to sign-in, with the admin pages hidden', async () => {
    await browser.page.goto(`${server.url}/account`, { waitUntil: 'networkidle' });
    await browser.page.waitForURL(/\/accounts\/sign-in\?returnTo=%2Faccount$/);
    expect(await navigationLabels()).to.deep.equal(['Overview', 'API reference']);
    expect(await browser.page.locator('nav[aria-label="Account"]').innerText()).to.contain('Sign in');
  });

  it('shows a clear message for a wrong password and a missing e-mail', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Sign in' }).click();
    expect(await page.locator('mat-error').first().innerText()).to.equal('Enter the e-mail address of your account.');
    await page.getByLabel('E-mail address').fill('designer@riffle.test');
    await page.getByLabel('Password').fill('not-the-demo-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    expect(await page.locator('.rf-form-problem').innerText()).to.contain('Wrong e-mail or password');
  });

  it('signs the designer in, back to the page asked for, with the designer\'s navigation', async () => {
    const { page } = browser;
    await page.getByLabel('Password').fill(demoPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${server.url}/account`);
    await page.getByRole('heading', { name: 'Your account' }).waitFor();
    expect(await page.locator('.rf-me').innerText()).to.contain('designer@riffle.test');
    const labels = await navigationLabels();
    expect(labels).to.include.members(['Overview', 'API reference']);
    expect(labels.some((label) => ['Users', 'Audit log', 'Demo mailbox'].includes(label))).to.equal(false);
    expect(await page.locator('nav[aria-label="Account"]').innerText()).to.contain('Demo Designer');
    await saveScreenshot(page, 'sign-in-designer');
  });

  it('keeps admin pages from the designer', async () => {
    await browser.page.goto(`${server.url}/admin/users`, { waitUntil: 'networkidle' });
    await browser.page.waitForURL(`${server.url}/`);
  });

  it('signs out: the session is revoked on the server and the sign-in link is back', async () => {
    const { page } = browser;
    const token = await page.evaluate(() => (JSON.parse(localStorage.getItem('riffle.session') ?? 'null') as { token: string } | null)?.token);
    expect(token).to.match(/^rfs_/);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/accounts\/sign-in$/);
    expect(await page.locator('nav[aria-label="Account"]').innerText()).to.contain('Sign in');
    expect(await page.evaluate(() => localStorage.getItem('riffle.session'))).to.equal(null);
    const answer = await fetch(`${server.url}/api/v1/auth/me`, { headers: { Authorization: `Bearer ${token}` } });
    expect(answer.status).to.equal(401);
    await saveScreenshot(page, 'sign-in-signed-out');
    expect(browser.offLoopbackRequests).to.deep.equal([]);
  });
});
