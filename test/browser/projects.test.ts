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

  it('two tabs save the same project: the later is told, and offered to reload or save as new', async () => {
    const first = app.page;
    await first.getByRole('link', { name: 'Site & system' }).click();
    await first.fill('input[name=length-0]', '200');
    await first.getByRole('button', { name: 'Save', exact: true }).click();
    await first.getByLabel('Project name').fill('Two-tab pond');
    await first.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
    await first.locator('.rf-save-note', { hasText: 'Saved as "Two-tab pond"' }).waitFor();

    // the second tab shares the sign-in, not the draft: it opens the project and saves a change
    const second = await app.browser.context.newPage();
    try {
      await second.goto(`${app.url}/design/projects`, { waitUntil: 'networkidle' });
      await second.getByRole('button', { name: 'Open Two-tab pond' }).click();
      await second.waitForURL(/design\/system/);
      await second.fill('input[name=length-0]', '250');
      await second.getByRole('button', { name: 'Save', exact: true }).click();
      await second.locator('.rf-save-note', { hasText: /^Saved at / }).waitFor();

      // the first tab saves on the revision it made: refused, and asked what to do
      await first.fill('input[name=length-0]', '270');
      await first.getByRole('button', { name: 'Save', exact: true }).click();
      const conflict = first.getByRole('dialog');
      await conflict.getByText('was saved in another tab or by someone else').waitFor();
      expect(await conflict.getByRole('button', { name: 'Save mine as new' }).isVisible()).to.equal(true);
      await saveScreenshot(first, 'projects-save-conflict');
      await conflict.getByRole('button', { name: 'Reload the saved project' }).click();
      await first.locator('.rf-save-note', { hasText: 'Reloaded "Two-tab pond"' }).waitFor();
      expect(await first.locator('input[name=length-0]').inputValue()).to.equal('250');

      // now the second tab is the stale one: it keeps its design as a new project
      await first.fill('input[name=length-0]', '280');
      await first.getByRole('button', { name: 'Save', exact: true }).click();
      await first.locator('.rf-save-note', { hasText: /^Saved at / }).waitFor();
      await second.fill('input[name=length-0]', '300');
      await second.getByRole('button', { name: 'Save', exact: true }).click();
      await second.getByRole('dialog').getByRole('button', { name: 'Save mine as new' }).click();
      await second.getByLabel('Project name').fill('Two-tab pond, second opinion');
      await second.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
      await second.locator('.rf-save-note', { hasText: 'Saved as "Two-tab pond, second opinion"' }).waitFor();
    } finally {
      await second.close();
    }
  });

  it("shows the project's site visits and what changed between two of them", async () => {
    const { page } = app;
    await page.getByRole('link', { name: 'Projects' }).click();
    await page.getByRole('link', { name: 'History of Two-tab pond', exact: true }).click();
    const revisions = page.getByRole('table', { name: 'Revisions' });
    await revisions.getByRole('row').nth(3).waitFor();
    expect(await revisions.getByRole('row').count()).to.equal(4);
    await page.getByRole('button', { name: 'Compare' }).click();
    const changes = page.getByRole('table', { name: 'Changes' });
    await changes.getByRole('row', { name: /\/system\/segments\/0\/length 250 280/ }).waitFor();
    expect(await page.getByRole('table', { name: 'Effect' }).getByRole('row').count()).to.equal(4);
    await saveScreenshot(page, 'projects-history');

    // this tab's design is the project's: it is recorded as a dated visit with notes
    await page.getByLabel('Visited on').fill('2026-11-28');
    await page.getByLabel('Notes').fill('Weir raised by two stones.');
    await page.getByRole('button', { name: 'Record visit' }).click();
    await revisions.getByRole('row', { name: /^4 2026-11-28 .*Weir raised by two stones\./ }).waitFor();
  });
});
