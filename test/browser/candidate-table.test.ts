import { expect } from 'chai';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { openBrowser, saveScreenshot, signInWithTheForm } from '../support/browser';
import { createUserWithSession, testPassword } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/*
 * The candidates as a designer reads them: on a wide screen a table whose columns the designer
 * chooses (kept for that user on the server, so after a reload and in another browser, and in
 * this browser when the server cannot take it), the pump kept in view while it scrolls sideways,
 * sortable and filtered by one box; on a phone one card per candidate with five figures and the
 * rest on tap; and the pipe size that would keep a fast segment under the velocity limit.
 */
describe('the candidates table and cards in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('candidate_table_browser'));
  let email: string;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(120, 5), 'Table Test Pumps');
    // a third external centrifugal, and solids of 2, 6 or 10 mm by id (2 mm for every fourth)
    await app.sequelize.query(
      `UPDATE pumps SET kind = IF(id % 3 = 0, 'external-centrifugal', 'submersible'),
         solids_handling_mm = ELT(1 + id % 4, 2, 6, 10, 6), updated_at = NOW(3)`,
    );
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  async function findCandidates(): Promise<void> {
    // the table holds the search before until the answer lands: wait for the answer, then its rows
    await Promise.all([
      app.page.waitForResponse((response) => response.url().endsWith('/api/v1/selections'), { timeout: 15_000 }),
      app.page.getByRole('button', { name: /Find candidates/ }).click(),
    ]);
    await app.page.getByRole('progressbar', { name: 'Searching the catalog' }).waitFor({ state: 'detached' });
    await app.page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
  }

  it('signs in, puts a small pipe on the route and finds candidates', async () => {
    const { page } = app;
    await page.setViewportSize({ width: 1400, height: 900 });
    await signInWithTheForm(page, app.url, email);
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    // the smallest size of the first segment's series: at the band's top its velocity is far over 5 ft/s
    await page.locator('[data-segment-size="0"]').click();
    const smallest = page.getByRole('option').first();
    const smallestLabel = (await smallest.innerText()).split(' (')[0];
    await smallest.click();
    await page.goto(`${app.url}/design/candidates`, { waitUntil: 'networkidle' });
    await findCandidates();
    const pipeSizes = page.locator('[data-pipe-sizes]');
    expect(await pipeSizes.innerText())
      .to.contain('over 5 ft/s')
      .and.to.contain(smallestLabel);
    expect(await pipeSizes.innerText()).to.match(/ft\/s: (use .+\.|no size of its series)/);
  });

  it('shows the search running and can cancel it, keeping the candidates found before', async () => {
    const { page } = app;
    const before = await page.locator('tr[data-candidate]').count();
    // the server's answer held back two seconds, as over a slow site connection
    await page.route('**/api/v1/selections', async (route) => {
      await new Promise((resolve) => setTimeout(resolve, 2000));
      await route.continue().catch(() => undefined);
    });
    // a search for at most 3: were it to land after the cancel, the table would shrink to 3
    expect(before).to.be.greaterThan(3);
    await page.fill('input[name=limit]', '3');
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.getByRole('progressbar', { name: 'Searching the catalog' }).waitFor();
    await page.getByRole('button', { name: /Cancel search/ }).click();
    await page.getByRole('status').filter({ hasText: 'Search cancelled' }).waitFor();
    expect(await page.getByRole('progressbar', { name: 'Searching the catalog' }).count()).to.equal(0);
    expect(await page.getByRole('button', { name: /Find candidates/ }).isEnabled()).to.equal(true);
    await page.waitForTimeout(2500); // past the held-back answer: a cancelled search must not land late
    expect(await page.locator('tr[data-candidate]').count()).to.equal(before);
    expect(await page.getByRole('status').filter({ hasText: 'Search cancelled' }).count()).to.equal(1);
    await page.unroute('**/api/v1/selections');
    await page.fill('input[name=limit]', '20');
    await findCandidates();
    expect(await page.locator('tr[data-candidate]').count()).to.equal(before);
  });

  it('keeps the pump in view while the wide table scrolls sideways, with nothing cut off the page', async () => {
    const { page } = app;
    expect(await page.locator('.rf-candidate-cards').isVisible()).to.equal(false);
    const scroller = page.locator('.rf-table-scroll');
    const pumpCell = page.locator('tr[data-candidate] td.mat-column-pump').first();
    const before = (await pumpCell.boundingBox())!.x;
    const scrolled = await scroller.evaluate((element) => {
      element.scrollLeft = element.scrollWidth;
      return element.scrollLeft;
    });
    expect(scrolled, 'the table is wider than its card at 1,400 px').to.be.greaterThan(0);
    await page.waitForTimeout(50); // one frame for the sticky cells to settle
    expect((await pumpCell.boundingBox())!.x).to.be.closeTo(before, 1);
    // the last column is reached by the scroll, not cut at the card's edge
    const reasons = (await page.locator('tr[data-candidate] td.mat-column-reasons').first().boundingBox())!;
    const box = (await scroller.boundingBox())!;
    expect(reasons.x + reasons.width).to.be.at.most(box.x + box.width + 1);
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).to.equal(true);
    await scroller.evaluate((element) => (element.scrollLeft = 0));
  });

  it('sorts by a column and narrows the rows with the filter box', async () => {
    const { page } = app;
    await page.locator('th.mat-column-flow').click();
    // the rows are read once the table has drawn the new order
    await page.locator('th.mat-column-flow[aria-sort="ascending"]').waitFor();
    const flows = (await page.locator('tr[data-candidate] td.mat-column-flow').allInnerTexts()).map((text) =>
      Number(text.replaceAll(',', '')),
    );
    expect(flows.length).to.be.greaterThan(3);
    expect(flows).to.deep.equal([...flows].sort((a, b) => a - b));

    const all = await page.locator('tr[data-candidate]').count();
    const model = (await page.locator('tr[data-candidate] td.mat-column-pump strong').nth(1).innerText()).trim();
    await page.getByLabel('Filter candidates').fill(model.toUpperCase());
    // every word of the filter, in any case, is somewhere in each row left
    const rows = await page.locator('tr[data-candidate]').allInnerTexts();
    expect(rows.length).to.be.within(1, all - 1);
    const words = model.toLowerCase().split(/\s+/);
    expect(rows.every((row) => words.every((word) => row.toLowerCase().includes(word)))).to.equal(true);
    expect(await page.locator('tr[data-candidate] td.mat-column-pump strong').allInnerTexts()).to.include(model);
    await page.getByLabel('Filter candidates').fill('no-such-pump-anywhere');
    await page.getByRole('status').filter({ hasText: 'No candidate matches' }).waitFor();
    expect(await page.locator('tr[data-candidate]').count()).to.equal(0);
    await page.getByLabel('Filter candidates').fill('');
    await page.locator('tr[data-candidate]').first().waitFor();
    expect(await page.locator('tr[data-candidate]').count()).to.equal(all);
  });

  it('hides the columns the designer unticks, and keeps that choice after a reload', async () => {
    const { page } = app;
    expect(await page.locator('th.mat-column-reasons').count()).to.equal(1);
    // the two ticks go to the server as one save, once the designer stops choosing
    const saved = page.waitForResponse(
      (response) => response.url().endsWith('/api/v1/account/preferences') && response.request().method() === 'PUT',
    );
    await page.getByLabel('Columns shown').click();
    await page.getByRole('option', { name: 'Why this place' }).click();
    await page.getByRole('option', { name: 'Warnings' }).click();
    await page.keyboard.press('Escape');
    const sent = (await saved).request().postDataJSON() as { candidateColumns: string[] };
    expect(sent.candidateColumns).to.include('flow').and.not.include('reasons').and.not.include('warnings');
    expect(await page.locator('th.mat-column-reasons').count()).to.equal(0);
    expect(await page.locator('th.mat-column-warnings').count()).to.equal(0);
    expect(await page.locator('th.mat-column-pump').count()).to.equal(1);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);

    await page.reload({ waitUntil: 'networkidle' });
    await findCandidates();
    expect(await page.locator('th.mat-column-reasons').count()).to.equal(0);
    expect(await page.locator('th.mat-column-flow').count()).to.equal(1);
    await saveScreenshot(page, 'candidates-chosen-columns');
  });

  it('keeps the chosen columns on the server: a fresh browser with nothing stored shows them after sign-in', async () => {
    const elsewhere = await openBrowser();
    try {
      const { page } = elsewhere;
      await page.setViewportSize({ width: 1400, height: 900 });
      await page.goto(`${app.url}/accounts/sign-in`, { waitUntil: 'networkidle' });
      expect(
        await page.evaluate(() => Object.keys(localStorage).filter((key) => key.startsWith('riffle.'))),
      ).to.deep.equal([]);
      const loaded = page.waitForResponse(
        (response) => response.url().endsWith('/api/v1/account/preferences') && response.request().method() === 'GET',
      );
      await page.fill('input[name=email]', email);
      await page.fill('input[name=password]', testPassword);
      await page.click('button[type=submit]');
      expect((await loaded).status()).to.equal(200);
      await page.goto(`${app.url}/design/candidates`, { waitUntil: 'networkidle' });
      await Promise.all([
        page.waitForResponse((response) => response.url().endsWith('/api/v1/selections'), { timeout: 15_000 }),
        page.getByRole('button', { name: /Find candidates/ }).click(),
      ]);
      await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
      expect(await page.locator('th.mat-column-reasons').count()).to.equal(0);
      expect(await page.locator('th.mat-column-warnings').count()).to.equal(0);
      expect(await page.locator('th.mat-column-flow').count()).to.equal(1);
      expect(await page.locator('th.mat-column-pump').count()).to.equal(1);
    } finally {
      await elsewhere.close();
    }
  });

  it('keeps the local choice, and says nothing, when the server cannot save it', async () => {
    const { page } = app;
    await page.route('**/api/v1/account/preferences', (route) =>
      route.request().method() === 'PUT'
        ? route.fulfill({
            status: 503,
            contentType: 'application/problem+json',
            body: '{"type":"about:blank","title":"Service unavailable","status":503}',
          })
        : route.continue(),
    );
    try {
      const refused = page.waitForResponse(
        (response) => response.url().endsWith('/api/v1/account/preferences') && response.request().method() === 'PUT',
      );
      await page.getByLabel('Columns shown').click();
      await page.getByRole('option', { name: 'Misses' }).click();
      await page.keyboard.press('Escape');
      expect((await refused).status()).to.equal(503);
      expect(await page.locator('th.mat-column-misses').count()).to.equal(0);
      await page.waitForTimeout(500); // time for a snack bar to open, were one to
      expect(await page.locator('.rf-problem-snack').count()).to.equal(0);
      expect(await page.getByRole('alert').count()).to.equal(0);
    } finally {
      await page.unroute('**/api/v1/account/preferences');
    }
    // the next load sends the choice the server missed, and this browser shows it meanwhile
    const resent = page.waitForResponse(
      (response) => response.url().endsWith('/api/v1/account/preferences') && response.request().method() === 'PUT',
    );
    await page.reload({ waitUntil: 'networkidle' });
    const body = (await resent).request().postDataJSON() as { candidateColumns: string[] };
    expect(body.candidateColumns).to.not.include('misses').and.not.include('reasons');
    await findCandidates();
    expect(await page.locator('th.mat-column-misses').count()).to.equal(0);
    expect(await page.locator('th.mat-column-reasons').count()).to.equal(0);
    // and puts it back for the later tests
    const restored = page.waitForResponse(
      (response) => response.url().endsWith('/api/v1/account/preferences') && response.request().method() === 'PUT',
    );
    await page.getByLabel('Columns shown').click();
    await page.getByRole('option', { name: 'Misses' }).click();
    await page.keyboard.press('Escape');
    expect((await restored).status()).to.equal(200);
  });

  it('shows one card per candidate on a phone, five figures each and the rest on tap', async () => {
    const { page } = app;
    await page.setViewportSize({ width: 390, height: 844 });
    const cards = page.locator('[data-candidate-card]');
    await cards.first().waitFor();
    expect(await page.locator('.rf-table-scroll').isVisible()).to.equal(false);
    expect(await cards.count()).to.equal(await page.locator('tr[data-candidate]').count());
    const first = cards.first();
    expect(await first.locator('.rf-card-figures dt').allInnerTexts()).to.deep.equal([
      'Flow',
      'TDH',
      '% of BEP',
      'Input power',
      'kWh / year',
    ]);
    expect(await first.getByText('Why this place').isVisible()).to.equal(false);
    await first.locator('summary').click();
    expect(await first.getByText('Why this place').isVisible()).to.equal(true);
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).to.equal(true);
    // the comparison pick works from the card too
    await first.getByRole('checkbox').check();
    await page.getByRole('link', { name: /Compare 1/ }).waitFor();
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    await saveScreenshot(page, 'candidates-phone-cards');
    await page.setViewportSize({ width: 1400, height: 900 });
  });

  it('narrows the search to a pump kind and the solids it must pass', async () => {
    const { page } = app;
    await page.getByRole('checkbox', { name: 'External centrifugal' }).check();
    await page.fill('input[name=minSolidsMm]', '6');
    await findCandidates();
    // the table held the search before until the answer lands
    await page.waitForFunction(() =>
      [...document.querySelectorAll('tr[data-candidate] td.mat-column-pump .rf-muted')].every((cell) =>
        cell.textContent?.includes('External centrifugal'),
      ),
    );
    const facts = await page.locator('tr[data-candidate] td.mat-column-pump .rf-muted').allInnerTexts();
    expect(facts.length).to.be.greaterThan(0);
    expect(facts.every((text) => /External centrifugal · passes (6|10) mm solids/.test(text))).to.equal(true);
    await page.getByRole('checkbox', { name: 'External centrifugal' }).uncheck();
    await page.fill('input[name=minSolidsMm]', '');
  });
});
