import { expect } from 'chai';
import { newSecretToken } from '../../server/accounts/secret-tokens';
import { PasswordResetLink } from '../../server/database/models';
import { createUserWithSession, testPassword } from '../support/accounts';
import { axeViolations, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';

/**
 * A designer makes an API token (the dialog asks for the password), loses it to a password reset,
 * sees on the account page which token the reset took, then revokes another with a password change.
 */
describe('API tokens, the password and a reset in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium();
  let email: string;
  let userId: number;
  const resetPassword = 'after-the-theft-weir-4';
  const changedPassword = 'changed-again-weir-5';

  before(async () => {
    const { user } = await createUserWithSession(app.sequelize, 'designer', {
      email: `token-revocation-${process.pid}@accounts.test`,
    });
    ({ email, id: userId } = user);
  });

  const signIn = async (password: string) => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=%2Faccount`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${app.url}/account`);
  };

  const makeToken = async (name: string, password: string) => {
    const { page } = app;
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill(name);
    await dialog.getByRole('checkbox', { name: /catalog:read/ }).check();
    await dialog.getByLabel('Your password').fill(password);
    await dialog.getByRole('button', { name: 'Create the token' }).click();
  };

  it('asks for the password before making a token, and says when it is wrong', async () => {
    const { page } = app;
    await signIn(testPassword);
    await page.getByRole('button', { name: 'New token' }).click();
    await makeToken('Estimating sheet', 'not-my-password');
    const dialog = page.getByRole('dialog');
    expect(await dialog.getByRole('alert').innerText()).to.contain('The password is not right');
    expect(await dialog.getByLabel('Your password').inputValue()).to.equal('');
    await dialog.getByLabel('Your password').fill(testPassword);
    await dialog.getByRole('button', { name: 'Create the token' }).click();
    expect(await dialog.getByTestId('new-token').innerText()).to.match(/^rft_/);
    await dialog.getByRole('button', { name: 'Done' }).click();
    await page.getByRole('cell', { name: 'Estimating sheet' }).waitFor();
  });

  it('after a reset, lists the token the reset revoked and when', async () => {
    const { page } = app;
    const link = newSecretToken('emailLink');
    await PasswordResetLink.create({ userId, tokenHash: link.hash, expiresAt: new Date(Date.now() + 3_600_000) });
    await page.goto(`${app.url}/accounts/reset-password?token=${link.token}`, { waitUntil: 'networkidle' });
    await page.getByLabel('New password').fill(resetPassword);
    await page.getByLabel('The same password again').fill(resetPassword);
    await page.getByRole('button', { name: 'Save the password' }).click();
    expect(await page.getByRole('status').innerText()).to.contain('This API token is revoked');
    const listed = await page.locator('.rf-revoked-tokens li').allInnerTexts();
    expect(listed).to.have.length(1);
    expect(listed[0]).to.match(/^Estimating sheet \(rft_[\w-]+…\)$/);

    await signIn(resetPassword);
    const note = page.getByRole('note');
    expect(await note.innerText()).to.match(
      /^The password reset on \w{3} \d{1,2}, \d{4}, [\d:]+\s[AP]M revoked this token: Estimating sheet\. /,
    );
    const row = page.getByRole('row', { name: /Estimating sheet/ });
    expect(await row.innerText()).to.match(/Revoked by the password reset on \w{3} \d{1,2}, \d{4}/);
    expect(await row.getByRole('button', { name: 'Revoke' }).count()).to.equal(0);
    await saveScreenshot(page, 'tokens-revoked-by-reset');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('a password change with the box ticked revokes the live tokens and says how many', async () => {
    const { page } = app;
    await page.getByRole('button', { name: 'New token' }).click();
    await makeToken('Drawing export', resetPassword);
    await page.getByRole('dialog').getByRole('button', { name: 'Done' }).click();
    await page
      .getByRole('row', { name: /Drawing export/ })
      .getByRole('button', { name: 'Revoke' })
      .waitFor();

    await page.getByLabel('Current password').fill(resetPassword);
    await page.getByLabel('New password').fill(changedPassword);
    await page.getByLabel('The same password again').fill(changedPassword);
    await page.getByRole('checkbox', { name: 'Also revoke my API tokens' }).check();
    await page.getByRole('button', { name: 'Change the password' }).click();
    expect(await page.locator('rf-change-password-form [role="status"]').innerText()).to.contain(
      '1 API token is revoked.',
    );
    const row = page.getByRole('row', { name: /Drawing export/ });
    await row.getByText('Revoked with the password change on').waitFor();
    expect(await page.getByRole('checkbox', { name: 'Also revoke my API tokens' }).isChecked()).to.equal(false);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
