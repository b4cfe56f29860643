import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { expect } from 'chai';
import { QueryTypes } from 'sequelize';
import { ProjectReport } from '../../server/database/models';
import { createUserWithSession, testPassword } from '../support/accounts';
import { useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';
import { readPdf } from '../server/reports/pdf-text';

/**
 * A designer fills in the company profile, saves a design and makes its proposal PDF from the
 * report step, and cancels one being made.
 */
describe('proposal PDF and parts list from the report step in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium();
  let email: string;

  before(async () => {
    ({ email } = (
      await createUserWithSession(app.sequelize, 'designer', { email: `reports-${process.pid}@accounts.test` })
    ).user);
  });

  it('saves the company profile', async () => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=%2Faccount%2Fprofile`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/account\/profile/);
    await page.getByLabel('Company name').fill('Millrace Pond Works');
    await page.getByLabel('Licence number').fill('PW-3312');
    await page.getByRole('button', { name: 'Save the profile' }).click();
    await page.getByRole('status').filter({ hasText: 'The profile is saved.' }).waitFor();
  });

  it('makes the PDF of the saved design, downloads it and lists it', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByLabel('Project name').fill('Millrace pond');
    await page.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
    await page.locator('.rf-save-note', { hasText: 'Saved as "Millrace pond"' }).waitFor();
    await page.getByRole('link', { name: 'Report' }).click();
    await page.getByRole('heading', { name: 'Proposal PDF and parts list' }).waitFor();
    // a project with no proposal yet says what to do next
    const empty = page.locator('[data-no-proposals]');
    await empty.waitFor();
    expect(await empty.innerText())
      .to.contain('No proposal of this project is stored yet')
      .and.contain('Make PDF');
    await page.getByLabel('Client').fill('Jo Fenwick');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Make PDF' }).click(),
    ]);
    expect(download.suggestedFilename()).to.match(/^millrace-pond-report-\d+\.pdf$/);
    const bytes = readFileSync(await download.path());
    const stored = await ProjectReport.findOne({ order: [['id', 'DESC']] });
    expect(createHash('sha256').update(bytes).digest('hex')).to.equal(stored!.sha256);
    const text = (await readPdf(bytes)).pages.join(' ');
    expect(text).to.include('Millrace Pond Works').and.to.include('PW-3312').and.to.include('Jo Fenwick');
    expect(text).to.include('Millrace pond');
    await page
      .getByRole('list', { name: 'Stored proposals' })
      .getByRole('button', { name: /Proposal \d+/ })
      .waitFor();
    await saveScreenshot(page, 'report-documents');

    const [csv] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Parts list (CSV)' }).click(),
    ]);
    expect(csv.suggestedFilename()).to.equal('millrace-pond-parts-list.csv');
    expect(readFileSync(await csv.path(), 'utf8')).to.match(/^section,item,size,quantity/);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
    expect(await page.locator('[data-no-proposals]').count()).to.equal(0);
  });

  it('shows the PDF being made and cancels it: the page is idle again and nothing is stored', async () => {
    const { page } = app;
    const stored = page.getByRole('list', { name: 'Stored proposals' }).getByRole('listitem');
    const listedBefore = await stored.count();
    const countBefore = await ProjectReport.count();
    // the server is held at the moment of storing: the suite's locking read keeps its insert waiting
    const lock = await app.sequelize.transaction();
    await app.sequelize.query('SELECT id FROM project_reports FOR UPDATE', { transaction: lock });
    const insertsWaiting = async () =>
      Number(
        (
          await app.sequelize.query<{ n: number | string }>(
            "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE 'INSERT INTO `project_reports`%'",
            { type: QueryTypes.SELECT },
          )
        )[0].n,
      );
    try {
      await page.getByRole('button', { name: 'Make PDF' }).click();
      await page.getByRole('progressbar', { name: 'Making the PDF' }).waitFor();
      await page.getByRole('status').filter({ hasText: 'Making the PDF: working out the figures' }).waitFor();
      expect(await page.getByRole('button', { name: 'Make PDF' }).isDisabled()).to.equal(true);
      for (let tries = 0; (await insertsWaiting()) === 0; tries++) {
        if (tries > 400) throw new Error('the server never reached the insert');
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
      await saveScreenshot(page, 'report-documents-making');
      await page.getByRole('button', { name: 'Cancel PDF' }).click();
      await page.getByRole('status').filter({ hasText: 'PDF cancelled: nothing is stored' }).waitFor();
      expect(await page.getByRole('progressbar', { name: 'Making the PDF' }).count()).to.equal(0);
      expect(await page.getByRole('button', { name: 'Make PDF' }).isEnabled()).to.equal(true);
      expect(await page.getByRole('button', { name: 'Parts list (CSV)' }).isEnabled()).to.equal(true);
      await page.waitForTimeout(300); // for the server to see the connection close
    } finally {
      await lock.commit();
    }
    // the held insert runs, finds its caller gone and is rolled back; a locking count waits for that
    for (let tries = 0; (await insertsWaiting()) > 0; tries++) {
      if (tries > 400) throw new Error('the held insert never ran');
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    const settled = await app.sequelize.transaction(async (transaction) =>
      Number(
        (
          await app.sequelize.query<{ n: number | string }>(
            'SELECT COUNT(*) AS n FROM project_reports LOCK IN SHARE MODE',
            { type: QueryTypes.SELECT, transaction },
          )
        )[0].n,
      ),
    );
    expect(settled).to.equal(countBefore);
    await page.reload({ waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: 'Proposal PDF and parts list' }).waitFor();
    await stored.first().waitFor();
    expect(await stored.count()).to.equal(listedBefore);
  });
});
