import { expect } from 'chai';
import { createUserWithSession, testPassword } from '../support/accounts';
import { axeViolations, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';

/** A designer saves a design as a project, changes the site, and opens the saved project again. */
describe('saved projects in Chromium', function () {
  this.timeout(90_000);
  const app = useAppInChromium();
  let email: string;

  before(async () => {
    ({ email } = (
      await createUserWithSession(app.sequelize, 'designer', { email: `projects-${process.pid}@accounts.test` })
    ).user);
  });

  it('saves the design under a name', async () => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=%2Fdesign%2Fsystem`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/design\/system/);
    expect(await page.locator('.rf-project-name').innerText()).to.contain('Unsaved design');
    await page.fill('input[name=length-0]', '310');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByLabel('Project name').fill('Quarry garden stream');
    await page.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
    await page.locator('.rf-save-note', { hasText: 'Saved as "Quarry garden stream"' }).waitFor();
    expect(await page.locator('.rf-project-name').innerText()).to.contain('Quarry garden stream');
  });

  it('saves a change into the same project, and opens the saved design again after the draft moved on', async () => {
    const { page } = app;
    await page.fill('input[name=length-0]', '330');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.locator('.rf-save-note', { hasText: /^Saved at / }).waitFor();
    await page.fill('input[name=length-0]', '999');
    await page.getByRole('link', { name: 'Projects' }).click();
    await page.getByRole('row', { name: /Quarry garden stream/ }).waitFor();
    expect(await page.getByRole('row').count()).to.equal(2);
    await saveScreenshot(page, 'projects-list');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    await page.getByRole('button', { name: 'Open Quarry garden stream' }).click();
    await page.waitForURL(/design\/system/);
    expect(await page.locator('input[name=length-0]').inputValue()).to.equal('330');
  });

  it('deletes the project: the list is empty and the design is unsaved again', async () => {
    const { page } = app;
    await page.getByRole('link', { name: 'Projects' }).click();
    await page.getByRole('button', { name: 'Delete Quarry garden stream' }).click();
    await page.getByText('No saved projects yet').waitFor();
    expect(await page.locator('.rf-project-name').innerText()).to.contain('Unsaved design');
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
