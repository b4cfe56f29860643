import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { expect } from 'chai';
import { ProjectReport } from '../../server/database/models';
import { createUserWithSession, testPassword } from '../support/accounts';
import { useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';
import { readPdf } from '../server/reports/pdf-text';

/** A designer fills in the company profile, saves a design and makes its proposal PDF from the report step. */
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
  });
});
