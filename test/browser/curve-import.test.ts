import { expect } from 'chai';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { createUserWithSession, testPassword } from '../support/accounts';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';
import { seedDemoCatalog } from '../data-import/catalog-fixtures';

/** Head at the second point rises a little (1.3 % of shut-off head): flagged as a warning, not refused. */
const fileWithWarning = [
  '# Invented pump for the browser test.',
  'riffle-curve-table,1',
  'flow-unit,m3/h',
  'head-unit,m',
  'efficiency-unit,%',
  'model_code,display_name,kind,flow,head,efficiency',
  'BRW-7,Browser test fountain pump 7,submersible,0,7.5,0',
  'BRW-7,,,1,7.6,21',
  'BRW-7,,,2,7.2,36',
  'BRW-7,,,3,6.4,44',
  'BRW-7,,,4,5.1,45',
  'BRW-7,,,5,3.4,39',
].join('\n');

describe('a supplier admin loads a curve table in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('curve_import_browser'));
  let email: string;
  const folder = mkdtempSync(join(tmpdir(), 'riffle-curve-upload-'));
  const file = join(folder, 'browser-test-curves.csv');

  before(async () => {
    const [alderbrook] = await seedDemoCatalog(app.sequelize);
    ({
      user: { email },
    } = await createUserWithSession(app.sequelize, 'supplier-admin', {
      supplierId: alderbrook.id,
      name: 'Browser Supplier Admin',
    }));
    writeFileSync(file, fileWithWarning);
  });

  after(() => {
    rmSync(folder, { recursive: true, force: true });
  });

  it('signs in and reaches the import page for its own supplier', async () => {
    const { page } = app;
    await page.goto(`${app.url}/curve-imports`, { waitUntil: 'networkidle' });
    await page.waitForURL(/\/accounts\/sign-in/);
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${app.url}/curve-imports`);
    await page.locator('.rf-supplier', { hasText: 'Alderbrook Demo Pumps' }).waitFor();
    await page.locator('.rf-history', { hasText: 'demo seed' }).waitFor();
  });

  it('uploads a file and sees the preview with the head-rise warning; nothing is saved yet', async () => {
    const { page } = app;
    await page.locator('input[type=file]').setInputFiles(file);
    await page.locator('.rf-summary', { hasText: 'Preview: nothing is saved yet' }).waitFor();
    const row = page.locator('table.rf-preview tr', { hasText: 'BRW-7' });
    expect(await row.innerText()).to.contain('New pump');
    expect(await row.locator('.rf-pump-warnings').innerText()).to.match(/Row 8, column head: head rises by 1\.3 %/);
    expect(await row.locator('rf-pump-curve-chart svg circle').count()).to.equal(6);
    const [stored] = await app.sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM pumps WHERE model_code = 'BRW-7'",
      { type: QueryTypes.SELECT },
    );
    expect(Number(stored.n)).to.equal(0);
    await saveScreenshot(page, 'curve-import-preview');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('shows the send in progress and can cancel it: nothing is saved and the preview is not replaced', async () => {
    const { page } = app;
    // hold the upload so that the send is still running when Cancel is pressed
    let held = 0;
    await page.route('**/curve-imports', (route) => {
      if (route.request().method() !== 'POST') return route.continue();
      held += 1;
      return new Promise<void>(() => undefined);
    });
    try {
      await page.getByRole('button', { name: /Commit 1 pump/ }).click();
      const progress = page.getByRole('region', { name: 'Progress' });
      await progress.waitFor();
      expect(await progress.locator('mat-progress-bar').count()).to.equal(1);
      expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
      await progress.getByRole('button', { name: 'Cancel' }).click();
      await progress.waitFor({ state: 'detached' });
      expect(await page.locator('.rf-problem').innerText()).to.contain('Cancelled: nothing was saved');
      expect(held).to.equal(1);
    } finally {
      await page.unroute('**/curve-imports');
    }
    const [stored] = await app.sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM pumps WHERE model_code = 'BRW-7'",
      { type: QueryTypes.SELECT },
    );
    expect(Number(stored.n)).to.equal(0);
    await page.locator('.rf-summary', { hasText: 'Preview: nothing is saved yet' }).waitFor();
  });

  it('commits, downloads the current table with the new pump, and the pump appears in the catalog with its curve', async () => {
    const { page } = app;
    await page.getByRole('button', { name: /Commit 1 pump/ }).click();
    await page.locator('.rf-summary', { hasText: 'Saved as import' }).waitFor();
    await page.locator('.rf-history', { hasText: 'browser-test-curves.csv' }).waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download the current table' }).click(),
    ]);
    expect(download.suggestedFilename()).to.equal('ALDERBROOK-curve-table.csv');
    const table = readFileSync(await download.path(), 'utf8');
    expect(table).to.match(/^# Curve table of .+\nriffle-curve-table,1\nflow-unit,/);
    expect(table).to.contain('BRW-7,Browser test fountain pump 7,submersible,');

    await page.goto(`${app.url}/catalog`, { waitUntil: 'networkidle' });
    await page.getByLabel('Model or name').fill('BRW');
    await page.getByRole('button', { name: 'Show pumps' }).click();
    // The unfiltered first page goes; the filtered one has the new pump alone.
    await page.locator('table.rf-pumps tr.mat-mdc-row').nth(1).waitFor({ state: 'detached' });
    const link = page.locator('table.rf-pumps a', { hasText: 'BRW-7' });
    await link.waitFor();
    expect(await page.locator('table.rf-pumps tr.mat-mdc-row').count()).to.equal(1);
    await link.click();
    await page.getByRole('heading', { name: 'Browser test fountain pump 7' }).waitFor();
    expect(await page.locator('rf-pump-curve-chart svg circle').count()).to.equal(6);
    expect(await page.locator('.rf-revisions').innerText()).to.contain('browser-test-curves.csv');
    await saveScreenshot(page, 'catalog-pump-page');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
