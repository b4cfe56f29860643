import { expect } from 'chai';
import { readFileSync } from 'node:fs';
import { DESIGN_CAUTIONS } from '../../shared/messages/design-cautions';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot, signInWithTheForm } from '../support/browser';
import { createUserWithSession } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/*
 * The designer's whole flow in Chromium against the real server and database: sign in, build the
 * system, plan the band from pond turnover, search, compare three candidates, export the chart.
 */
describe('pump selection in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('selection_browser'));
  let email: string;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(400, 11), 'Browser Test Pumps');
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  it('signs the designer in', async () => {
    const { page } = app;
    await signInWithTheForm(page, app.url, email);
  });

  it('builds the system from two measured levels and previews its curve', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    // A typed static head past its limit blocks the form only while it is the one in use.
    await page.fill('input[name=staticHead]', '2000');
    await page.locator('input[name=staticHead]').blur();
    await page.locator('mat-error', { hasText: 'static head must be at most 1640 ft' }).waitFor();
    await page.getByText('From two measured water levels').click();
    await page.fill('input[name=intakeLevel]', '100');
    await page.fill('input[name=dischargeLevel]', '114.5');
    await page.locator('.rf-derived', { hasText: 'Static head 14.5 ft' }).waitFor();
    expect(await page.getByRole('link', { name: /Next: flow band/ }).getAttribute('aria-disabled')).to.not.equal(
      'true',
    );
    // 1900 ft between the levels: above the 500 m static head limit, as the API would say
    await page.fill('input[name=dischargeLevel]', '2000');
    await page.locator('.rf-problem[role=alert]', { hasText: 'static head must be at most 1640 ft' }).waitFor();
    expect(await page.getByRole('link', { name: /Next: flow band/ }).getAttribute('aria-disabled')).to.equal('true');
    await page.fill('input[name=dischargeLevel]', '114.5');
    await page.locator('.rf-derived', { hasText: 'Static head 14.5 ft' }).waitFor();
    expect(await page.locator('.rf-problem[role=alert]').count()).to.equal(0);
    await page.fill('input[name=length-0]', '260');
    // Hazen-Williams by hand would differ: the preview must move when the length does.
    const before = await page.locator('[role=status]', { hasText: 'TDH' }).textContent();
    await page.fill('input[name=length-0]', '240');
    await page.waitForFunction(
      (text) => document.querySelector('.rf-builder [role=status]')?.textContent !== text,
      before,
    );
    expect(await page.locator('rf-system-curve-preview svg path').count()).to.be.greaterThan(0);
    // the preview's numbers: open the table and read no flow from 0 upwards with a rising head
    await page.locator('rf-system-curve-preview summary').click();
    const heads = (await page.locator('rf-system-curve-preview tbody tr td').allInnerTexts()).map((text) =>
      Number(text.replaceAll(',', '')),
    );
    expect(heads.length).to.be.within(2, 13);
    expect(heads[0]).to.be.closeTo(14.5, 0.05);
    expect(heads).to.deep.equal([...heads].sort((a, b) => a - b));
    await saveScreenshot(page, 'site-and-system');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('keeps the measured system when the design switches to metric and back', async () => {
    const { page } = app;
    const value = (name: string) => page.locator(`input[name=${name}]`).inputValue();
    await page.getByRole('radio', { name: 'Metric (L/min, m, mm)' }).click();
    // 1 ft = 0.3048 m exactly
    await page.locator('.rf-derived', { hasText: 'Static head 4.42 m' }).waitFor();
    expect([await value('intakeLevel'), await value('dischargeLevel'), await value('length-0')]).to.deep.equal([
      '30.48',
      '34.8996',
      '73.152',
    ]);
    await page.getByRole('radio', { name: 'US (gpm, ft, in)' }).click();
    await page.locator('.rf-derived', { hasText: 'Static head 14.5 ft' }).waitFor();
    expect([await value('intakeLevel'), await value('dischargeLevel'), await value('length-0')]).to.deep.equal([
      '100',
      '114.5',
      '240',
    ]);
  });

  it('plans the band from a pond turnover and finds candidates', async () => {
    const { page } = app;
    await page.getByRole('link', { name: /Next: flow band/ }).click();
    await page.getByText('Pond turnover').click();
    await page.fill('input[name=volume]', '6000');
    await page.fill('input[name=turnoversMin]', '1');
    await page.fill('input[name=turnoversMax]', '1.3');
    // 6,000 gal once an hour is 100 gpm (1 gpm = 60 gph)
    await page.locator('.rf-suggestion', { hasText: '100 to 130 gpm' }).waitFor();
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    // 10 m3/s is 158503 gpm: the band's flows are held to the search's plausible flow
    await page.fill('input[name=flowMax]', '200000');
    await page.locator('input[name=flowMax]').blur();
    await page.locator('mat-error', { hasText: 'flow must be at most 158500 gpm' }).waitFor();
    await page.getByRole('button', { name: /Use as the duty band/ }).click();
    await page.getByRole('button', { name: /Next: find candidates/ }).click();
    await page.waitForURL(/design\/candidates/);
    await page.getByText('Three in parallel').click();
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
    expect(await page.locator('tr[data-candidate]').count()).to.be.greaterThan(3);
    expect(await page.locator('.rf-results-head').textContent()).to.contain('in the band');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('compares three candidates on one chart, in both unit systems, and exports it', async () => {
    const { page } = app;
    const boxes = page.locator('tr[data-candidate] mat-checkbox input');
    for (let index = 0; index < 3; index += 1) await boxes.nth(index).check();
    await page.getByRole('link', { name: /Compare 3/ }).click();
    await page.locator('svg.rf-chart path.rf-pump-curve').first().waitFor();
    expect(await page.locator('svg.rf-chart path.rf-pump-curve').count()).to.equal(3);
    expect(await page.locator('svg.rf-chart path.rf-system-curve').count()).to.equal(1);
    expect(await page.locator('svg.rf-chart path.rf-operating-point').count()).to.equal(3);
    expect(await page.locator('.rf-side thead th').count()).to.equal(4);

    // the first candidates' points may lie on one another: the hover goes to whichever is on top
    await page.locator('svg.rf-chart path.rf-operating-point').first().hover({ force: true });
    await page.locator('.rf-details', { hasText: 'TDH' }).waitFor();
    await page.locator('svg.rf-chart path.rf-operating-point').nth(1).focus();
    await page.locator('.rf-details', { hasText: 'gpm at' }).waitFor();

    await page.getByRole('radio', { name: 'SI', exact: true }).click();
    await page.locator('svg.rf-chart text', { hasText: 'Flow (L/min)' }).waitFor();
    await page.getByRole('radio', { name: 'US', exact: true }).click();
    await page.locator('svg.rf-chart text', { hasText: 'Flow (gpm)' }).waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: /SVG/ }).click(),
    ]);
    expect(download.suggestedFilename()).to.equal('riffle-pump-comparison.svg');
    const exported = readFileSync(await download.path(), 'utf8');
    expect(exported).to.match(/^<\?xml/);
    expect(exported.match(/class="rf-pump-curve"/g)?.length).to.equal(3);
    expect(exported).to.contain('class="rf-system-curve"');

    await saveScreenshot(page, 'pump-comparison');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });

  it('gives the chart its numbers in a table, collapsed until asked for, matching the marks', async () => {
    const { page } = app;
    const numbers = page.locator('rf-chart-numbers');
    expect(await numbers.locator('table').first().isVisible()).to.equal(false);
    await numbers.getByText('Numbers of this chart').click();
    const points = numbers.getByRole('table', { name: 'Operating points' });
    await points.waitFor();
    const rows = await points.locator('tbody tr').allInnerTexts();
    expect(rows.length).to.equal(3);
    // each mark's label and its row give the same flow and head
    const labels = await page
      .locator('svg.rf-chart path.rf-operating-point')
      .evaluateAll((marks) => marks.map((mark) => mark.getAttribute('aria-label') ?? ''));
    for (const [index, label] of labels.entries()) {
      const [, flow, head] = /: ([\d.]+) gpm at ([\d.]+) ft/.exec(label)!;
      const cells = rows[index].split('\t');
      expect(Number(cells[1].replaceAll(',', ''))).to.be.closeTo(Number(flow), 0.051);
      expect(Number(cells[2].replaceAll(',', ''))).to.be.closeTo(Number(head), 0.051);
    }
    const curves = numbers.getByRole('table', { name: /Head at each flow/ });
    expect(await curves.locator('thead th').count()).to.equal(5);
    expect(await curves.locator('tbody tr').count()).to.equal(9);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('puts the system, the band, the compared pumps, the chart and the cautions in a printable report', async () => {
    const { page } = app;
    await page.getByRole('link', { name: /Next: the report/ }).click();
    await page.waitForURL(/design\/report/);
    await page.getByRole('heading', { name: 'Pump selection report' }).waitFor();
    const report = page.locator('article.rf-report');
    expect(await report.innerText()).to.contain('Static head');
    expect(await report.getByRole('region', { name: 'Site and system' }).innerText()).to.contain('PVC Schedule 40, 3"');
    expect(await report.getByRole('region', { name: 'Duty band' }).innerText()).to.match(
      /100 to 130 gpm; the system needs [\d.]+ to [\d.]+ ft of total dynamic head/,
    );
    expect(await report.getByRole('heading', { name: 'Pumps compared' }).count()).to.equal(1);
    expect(await report.locator('tr.rf-reasons-row').count()).to.equal(3);
    expect(await report.locator('svg.rf-chart path.rf-pump-curve').count()).to.equal(3);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    await page.emulateMedia({ media: 'print' });
    try {
      expect(await page.locator('.rf-toolbar').isVisible()).to.equal(false);
      expect(await page.locator('.rf-design-steps').isVisible()).to.equal(false);
      expect(await page.getByRole('button', { name: /Print or save as PDF/ }).isVisible()).to.equal(false);
      expect(await page.locator('rf-cautions-panel').isVisible()).to.equal(true);
      // the panel and the proposal carry the same cautions, from one list
      expect(await page.locator('rf-cautions-panel li').count()).to.equal(DESIGN_CAUTIONS.length);
      await saveScreenshot(page, 'selection-report-print');
    } finally {
      await page.emulateMedia({ media: 'screen' });
    }
  });

  it('searches again with a standby pump, and every candidate says so', async () => {
    const { page } = app;
    await page.getByRole('link', { name: /Candidates/ }).click();
    await page.waitForURL(/design\/candidates/);
    await page.getByRole('switch', { name: /Plus one standby pump/ }).click();
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('tr[data-candidate] td', { hasText: '+ standby' }).first().waitFor({ timeout: 15_000 });
    const labels = await page.locator('tr[data-candidate] td.mat-column-arrangement').allInnerTexts();
    expect(labels.length).to.be.greaterThan(3);
    expect(labels.every((label) => label.endsWith('+ standby'))).to.equal(true);
  });
  it('shows input power as wire-to-water, ranks by life-cycle cost when asked, and says plainly when no pump reaches the band', async () => {
    const { page } = app;
    await page.getByRole('switch', { name: /Plus one standby pump/ }).click();
    await page.selectOption('select[name=rankBy]', 'life-cycle-cost');
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('.rf-results-head', { hasText: 'then by life-cycle cost' }).waitFor({ timeout: 15_000 });
    expect(await page.locator('th.mat-column-power').innerText()).to.contain('wire-to-water');
    const costs = await page.locator('tr[data-candidate] td.mat-column-lifeCycleCost').allInnerTexts();
    expect(costs.length).to.be.greaterThan(0);
    // an amount in a currency, or a dash for a pump with no price in the search's currency
    expect(costs.every((cost) => /^(–|[\d,]+ [A-Z]{3})$/.test(cost.trim()))).to.equal(true);
    expect((await page.locator('[data-unmet]').allInnerTexts()).join(' ')).to.not.contain(
      'No pump in the catalog reaches',
    );

    await page.getByRole('link', { name: /Flow band/ }).click();
    await page.waitForURL(/design\/band/);
    await page.fill('input[name=flowMin]', '2000');
    await page.fill('input[name=flowMax]', '3000');
    await page.getByRole('button', { name: /Next: find candidates/ }).click();
    await page.waitForURL(/design\/candidates/);
    await page.getByRole('button', { name: /Find candidates/ }).click();
    const unmet = page.locator('[data-unmet]', { hasText: 'No pump in the catalog reaches the duty band' });
    await unmet.waitFor({ timeout: 15_000 });
    expect(await unmet.innerText()).to.contain('a larger pipe');
    const misses = await page.locator('tr[data-candidate] td.mat-column-misses').allInnerTexts();
    expect(misses.length).to.be.greaterThan(0);
    expect(misses.every((miss) => miss.includes('duty band'))).to.equal(true);
  });
});
