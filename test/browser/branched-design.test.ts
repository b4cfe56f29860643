import { expect } from 'chai';
import type { Page } from 'playwright-core';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';
import { createUserWithSession, testPassword } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/** The preview's branch table as numbers: one row per branch, [name, flow at the band's low end, at its high end]. */
async function branchFlows(page: Page): Promise<Array<[string, number, number]>> {
  const rows = page.locator('rf-system-curve-preview table.rf-branch-flows tbody tr');
  const count = await rows.count();
  const read: Array<[string, number, number]> = [];
  for (let index = 0; index < count; index += 1) {
    const cells = await rows.nth(index).locator('th, td').allInnerTexts();
    read.push([cells[0], Number(cells[1].replaceAll(',', '')), Number(cells[2].replaceAll(',', ''))]);
  }
  return read;
}

/*
 * A pond whose pump feeds a falls and a filter return through one common run, with a short
 * suction line: built on the site page, searched, saved, and opened again from the projects list.
 */
describe('a branched design in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('branched_browser'));
  let email: string;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(200, 5), 'Branch Test Pumps');
    ({ email } = (
      await createUserWithSession(app.sequelize, 'designer', { email: `branches-${process.pid}@accounts.test` })
    ).user);
  });

  it('builds a falls and a filter return after a common run, with a suction side, and previews each branch', async () => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in?returnTo=%2Fdesign%2Fsystem`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/design\/system/);

    // a single route draws pump to outlet
    expect(await page.locator('rf-system-schematic svg').getAttribute('aria-label')).to.contain(
      'of pipe to the outlet 14.5 ft above the intake',
    );
    await page.getByRole('radio', { name: /A common run splitting into branches/ }).click();
    await page.locator('input[name=branch-name-1]').waitFor();
    expect(await page.locator('input[name=branch-name-0]').inputValue()).to.equal('Falls');
    expect(await page.locator('input[name=branch-name-1]').inputValue()).to.equal('Filter return');

    // the common run: a suction line from the intake, then 30 ft to the tee
    await page.getByRole('button', { name: 'Common-run segment' }).click();
    await page.fill('input[name=length-0]', '8');
    await page.fill('input[name=length-1]', '30');
    await page.locator('input[name=suction-0]').check();
    // a suction side needs the site and pump elevations, as the calculations do
    await page.locator('.rf-problem[role=alert]', { hasText: /site/i }).waitFor();
    expect(await page.getByRole('link', { name: /Next: flow band/ }).getAttribute('aria-disabled')).to.equal('true');
    await page.fill('input[name=siteElevation]', '800');
    await page.fill('input[name=pumpElevation]', '2');

    await page.fill('input[name=branch-staticHead-0]', '6');
    await page.fill('input[name=length-b0-0]', '40');
    await page.fill('input[name=branch-staticHead-1]', '1.5');
    await page.fill('input[name=branch-outletPressureHead-1]', '3');
    await page.fill('input[name=length-b1-0]', '150');

    // a repeated name is refused before the calculations would
    await page.fill('input[name=branch-name-1]', 'falls');
    await page.locator('.rf-problem[role=alert]', { hasText: 'Give each branch its own name.' }).waitFor();
    await page.fill('input[name=branch-name-1]', 'Filter return');
    expect(await page.locator('.rf-problem[role=alert]').count()).to.equal(0);
    expect(await page.getByRole('link', { name: /Next: flow band/ }).getAttribute('aria-disabled')).to.not.equal(
      'true',
    );

    // the band is 90 to 130 gpm: each branch's share at both ends, adding up to the total
    await page.locator('rf-system-curve-preview table.rf-branch-flows').waitFor();
    await page.waitForFunction(() =>
      document.querySelector('.rf-builder [role=status]')?.textContent?.includes('Filter return'),
    );
    const flows = await branchFlows(page);
    expect(flows.map(([name]) => name)).to.deep.equal(['Falls', 'Filter return']);
    expect(flows[0][1] + flows[1][1]).to.be.closeTo(90, 0.2);
    expect(flows[0][2] + flows[1][2]).to.be.closeTo(130, 0.2);
    // more total flow lifts more over the falls; the longer filter return takes most of a small flow
    expect(flows[0][2]).to.be.greaterThan(flows[0][1]);
    expect(flows[0][1]).to.be.greaterThan(0);
    expect(flows[1][1]).to.be.greaterThan(flows[0][1]);
    const status = await page.locator('.rf-builder [role=status]').innerText();
    expect(status).to.contain(`Falls ${flows[0][2].toFixed(1)} gpm`);

    // the chart draws each branch's flow at the pump's head; its table adds up to the total at every row
    const preview = page.locator('rf-system-curve-preview');
    expect(
      await preview.locator('path.rf-branch-line').evaluateAll((paths) => paths.map((p) => p.dataset['branch'])),
    ).to.deep.equal(['Falls', 'Filter return']);
    const branchTable = preview.locator('table', { hasText: "Each branch's flow at the pump's head" });
    const rows = await branchTable
      .locator('tbody tr')
      .evaluateAll((trs) =>
        trs.map((tr) =>
          [...tr.querySelectorAll('th, td')].map((cell) => Number(cell.textContent!.replaceAll(',', ''))),
        ),
      );
    expect(rows.length).to.be.greaterThan(5);
    for (const [total, , falls, filterReturn] of rows) expect(falls + filterReturn).to.be.closeTo(total, 0.2);
    expect(rows.at(-1)![2]).to.be.greaterThan(rows[1][2]);

    // the schematic: pump, common run, tee and both outlets with their levels, in words too
    const schematic = page.locator('rf-system-schematic');
    const label = (await schematic.locator('svg').getAttribute('aria-label')) ?? '';
    expect(label).to.contain('8 ft suction pipe');
    expect(label).to.contain('30 ft common run to a tee splitting into 2 branches');
    expect(label).to.contain('Falls 6 ft above the intake');
    expect(label).to.contain('Filter return 1.5 ft above the intake');
    expect(await schematic.locator('svg .rf-outlet').count()).to.equal(2);
    expect(await schematic.locator('svg .rf-tee').count()).to.equal(1);
    expect(await schematic.locator('svg text.rf-outlet-label').allTextContents()).to.deep.equal([
      'Falls: 6 ft',
      'Filter return: 1.5 ft',
    ]);
    expect(await schematic.locator('tbody tr').count()).to.equal(2);
    await preview.scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'branched-site-and-system');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it("finds pumps for the branched system, each with its branches' flows", async () => {
    const { page } = app;
    await page.getByRole('link', { name: /Next: flow band/ }).click();
    await page.getByRole('button', { name: /Next: find candidates/ }).click();
    await page.waitForURL(/design\/candidates/);
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 30_000 });
    const split = await page.locator('tr[data-candidate]').first().locator('.rf-branch-flows').innerText();
    expect(split).to.match(/^Falls \d+\.\d gpm, Filter return \d+\.\d gpm$/);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);

    // the report gives the same split per pump, with the NPSH of the suction side
    const [, falls, filterReturn] = /^Falls (\S+) gpm, Filter return (\S+) gpm$/.exec(split)!;
    await page.getByRole('link', { name: 'Report' }).click();
    const table = page.getByTestId('branch-and-suction');
    await table.waitFor();
    const headers = await table.locator('thead th').allInnerTexts();
    expect(headers.slice(1, 3)).to.deep.equal([
      'Falls: flow (gpm) · velocity (ft/s)',
      'Filter return: flow (gpm) · velocity (ft/s)',
    ]);
    const firstRow = await table.locator('tbody tr').first().locator('td').allInnerTexts();
    expect(firstRow[0]).to.match(new RegExp(`^${falls} · \\d+\\.\\d`));
    expect(firstRow[1]).to.match(new RegExp(`^${filterReturn} · \\d+\\.\\d`));
    expect(firstRow.slice(2).join(' ')).to.match(/ratio \d+\.\d\d, (enough|short)|submersible|not published/);
    await table.scrollIntoViewIfNeeded();
    await saveScreenshot(page, 'branched-report');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('saves the project and opens it again from the projects list with the branches as entered', async () => {
    const { page } = app;
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByLabel('Project name').fill('Falls and filter pond');
    await page.getByRole('dialog').getByRole('button', { name: 'Save', exact: true }).click();
    await page.locator('.rf-save-note', { hasText: 'Saved as "Falls and filter pond"' }).waitFor();

    // the draft moves on, then the saved project is opened again
    await page.getByRole('link', { name: 'Site & system' }).click();
    await page.fill('input[name=length-b0-0]', '999');
    await page.getByRole('radio', { name: 'One route to one outlet' }).click();
    await page.locator('input[name=branch-name-0]').waitFor({ state: 'detached' });
    await page.getByRole('link', { name: 'Projects' }).click();
    await page.getByRole('button', { name: 'Open Falls and filter pond' }).click();
    await page.waitForURL(/design\/system/);
    await page.locator('input[name=branch-name-1]').waitFor();
    const value = (name: string) => page.locator(`input[name=${name}]`).inputValue();
    expect(
      await Promise.all(
        [
          'branch-name-0',
          'branch-staticHead-0',
          'length-b0-0',
          'branch-name-1',
          'branch-staticHead-1',
          'branch-outletPressureHead-1',
          'length-b1-0',
          'length-0',
          'length-1',
          'siteElevation',
          'pumpElevation',
        ].map(value),
      ),
    ).to.deep.equal(['Falls', '6', '40', 'Filter return', '1.5', '3', '150', '8', '30', '800', '2']);
    expect(await page.locator('input[name=suction-0]').isChecked()).to.equal(true);
    expect(await page.locator('input[name=suction-1]').isChecked()).to.equal(false);
    expect(await page.getByRole('radio', { name: /A common run splitting into branches/ }).isChecked()).to.equal(true);
    expect((await branchFlows(page)).map(([name]) => name)).to.deep.equal(['Falls', 'Filter return']);

    // the web report draws the same schematic
    await page.goto(`${app.url}/design/report`, { waitUntil: 'networkidle' });
    const label = (await page.locator('rf-system-schematic svg').getAttribute('aria-label')) ?? '';
    expect(label).to.contain('Falls 6 ft above the intake');
    expect(await page.getByRole('cell', { name: 'Common run, suction side' }).count()).to.equal(1);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
