import { expect } from 'chai';
import { createUserWithSession, testPassword } from '../support/accounts';
import { axeViolations, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';

/** A designer changes the password from the account page, then signs in again with the new one. */
describe('changing the password in Chromium', function () {
  this.timeout(90_000);
  const app = useAppInChromium();
  let email: string;
  const newPassword = 'skimmer-weir-gravel-9';

  before(async () => {
    ({ email } = (
      await createUserWithSession(app.sequelize, 'designer', { email: `password-change-${process.pid}@accounts.test` })
    ).user);
  });

  const signIn = async (password: string) => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=%2Faccount`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
  };

  const fillChange = async (current: string) => {
    const { page } = app;
    await page.getByLabel('Current password').fill(current);
    await page.getByLabel('New password').fill(newPassword);
    await page.getByLabel('The same password again').fill(newPassword);
    await page.getByRole('button', { name: 'Change the password' }).click();
  };

  it('shows a wrong current password once, next to the form', async () => {
    const { page } = app;
    await signIn(testPassword);
    await page.waitForURL(`${app.url}/account`);
    await fillChange('not-my-password');
    expect(await page.locator('rf-change-password-form .rf-form-problem').innerText()).to.contain(
      'The current password is not right',
    );
    expect(await page.locator('.rf-problem-snack').count()).to.equal(0);
  });

  it('changes the password and says what happened to other sessions and tokens', async () => {
    const { page } = app;
    await fillChange(testPassword);
    const note = await page.locator('rf-change-password-form [role="status"]').innerText();
    expect(note).to.contain('Your password is changed');
    expect(note).to.contain('API tokens keep working');
    expect(await page.getByLabel('Current password').inputValue()).to.equal('');
    await saveScreenshot(page, 'password-changed');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('signs in with the new password and no longer with the old one', async () => {
    const { page } = app;
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/accounts\/sign-in$/);
    await signIn(testPassword);
    expect(await page.locator('.rf-form-problem').innerText()).to.contain('Wrong e-mail or password');
    await signIn(newPassword);
    await page.waitForURL(`${app.url}/account`);
    expect(await page.locator('.rf-me').innerText()).to.contain(email);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
