import { expect } from 'chai';
import { demoPassword } from '../../server/accounts/demo-accounts';
import { useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';

/** The demo designer (seeded by `npm test` into its database) signs in, sees a designer's toolbar, and signs out. */
describe('signing in and out in Chromium', function () {
  this.timeout(90_000);
  const app = useAppInChromium();

  const navigationLabels = async () =>
    (await app.page.locator('nav[aria-label="Main"] a').allInnerTexts()).map((text) =>
      text.replace(/^\S+\s+/, '').trim(),
    );

  it('sends a signed-out visitor from the account page to sign-in, with the admin pages hidden', async () => {
    await app.page.goto(`${app.url}/account`, { waitUntil: 'networkidle' });
    await app.page.waitForURL(/\/accounts\/sign-in\?returnTo=%2Faccount$/);
    expect(await navigationLabels()).to.deep.equal(['Overview', 'API reference']);
    expect(await app.page.locator('nav[aria-label="Account"]').innerText()).to.contain('Sign in');
  });

  it('shows a clear message for a wrong password and a missing e-mail', async () => {
    const { page } = app;
    await page.getByRole('button', { name: 'Sign in' }).click();
    expect(await page.locator('mat-error').first().innerText()).to.equal('Enter the e-mail address of your account.');
    await page.getByLabel('E-mail address').fill('designer@riffle.test');
    await page.getByLabel('Password').fill('not-the-demo-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    expect(await page.locator('.rf-form-problem').innerText()).to.contain('Wrong e-mail or password');
  });

  it("signs the designer in, back to the page asked for, with the designer's navigation", async () => {
    const { page } = app;
    await page.getByLabel('Password').fill(demoPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${app.url}/account`);
    await page.getByRole('heading', { name: 'Your account' }).waitFor();
    expect(await page.locator('.rf-me').innerText()).to.contain('designer@riffle.test');
    const labels = await navigationLabels();
    expect(labels).to.include.members(['Overview', 'API reference']);
    expect(labels.some((label) => ['Users', 'Audit log', 'Demo mailbox'].includes(label))).to.equal(false);
    expect(await page.locator('nav[aria-label="Account"]').innerText()).to.contain('Demo Designer');
    // the account page leads a designer to the company profile that heads every proposal
    expect(await page.getByRole('link', { name: 'company profile' }).getAttribute('href')).to.equal('/account/profile');
    await saveScreenshot(page, 'sign-in-designer');
  });

  it('fits a phone held upright: no sideways scrolling, and the links keep their names', async () => {
    const { page } = app;
    await page.setViewportSize({ width: 390, height: 844 });
    try {
      await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
      await page.getByRole('heading', { name: 'Pump selection' }).waitFor();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).to.be.at.most(390);
      for (const name of ['Overview', 'Design', 'Catalog', 'Sign out'])
        expect(
          await page.getByRole(name === 'Sign out' ? 'button' : 'link', { name, exact: true }).isVisible(),
          name,
        ).to.equal(true);
      await saveScreenshot(page, 'design-on-a-phone');
    } finally {
      await page.setViewportSize({ width: 1280, height: 900 });
    }
  });

  it('keeps admin pages from the designer', async () => {
    await app.page.goto(`${app.url}/admin/users`, { waitUntil: 'networkidle' });
    await app.page.waitForURL(`${app.url}/`);
  });

  it('signs out: the session is revoked on the server and the sign-in link is back', async () => {
    const { page } = app;
    const token = await page.evaluate(
      () => (JSON.parse(localStorage.getItem('riffle.session') ?? 'null') as { token: string } | null)?.token,
    );
    expect(token).to.match(/^rfs_/);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/accounts\/sign-in$/);
    expect(await page.locator('nav[aria-label="Account"]').innerText()).to.contain('Sign in');
    expect(await page.evaluate(() => localStorage.getItem('riffle.session'))).to.equal(null);
    const answer = await fetch(`${app.url}/api/v1/auth/me`, { headers: { Authorization: `Bearer ${token}` } });
    expect(answer.status).to.equal(401);
    await saveScreenshot(page, 'sign-in-signed-out');
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
