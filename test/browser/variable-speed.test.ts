import { expect } from 'chai';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot, signInWithTheForm } from '../support/browser';
import { createUserWithSession } from '../support/accounts';
import { seedDemoCatalog } from '../data-import/catalog-fixtures';

/*
 * A variable-speed demo pump (the invented AB-CEN-20 on a drive, 1450-3190 rpm, nominal 2900) in
 * Chromium: a small band on the example system asks less than its full-speed point, so the search
 * finds it at reduced speed; the candidates say the speed, and the comparison chart draws its
 * curve at that speed: shut-off head x r^2 (affinity laws), read from the chart's data attributes
 * against the catalog's stored fit.
 */
describe('a variable-speed pump found at reduced speed, in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('variable_speed_browser'));
  let email: string;
  let token: string;

  before(async () => {
    await seedDemoCatalog(app.sequelize);
    ({
      user: { email },
      token,
    } = await createUserWithSession(app.sequelize, 'designer'));
  });

  it('finds AB-CEN-20 at reduced speed and says the speed beside the pump', async () => {
    const { page } = app;
    await page.setViewportSize({ width: 1400, height: 900 });
    await signInWithTheForm(page, app.url, email);
    await page.goto(`${app.url}/design/band`, { waitUntil: 'networkidle' });
    await page.fill('input[name=flowMin]', '12');
    await page.fill('input[name=flowMax]', '18');
    await page.getByRole('button', { name: /Next: find candidates/ }).click();
    await page.waitForURL(/design\/candidates/);
    await page.fill('input[name=limit]', '100');
    const [answer] = await Promise.all([
      page.waitForResponse((response) => response.url().endsWith('/api/v1/selections'), { timeout: 15_000 }),
      page.getByRole('button', { name: /Find candidates/ }).click(),
    ]);
    expect(answer.status()).to.equal(200);
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
    await page.fill('input[name=candidateFilter]', 'AB-CEN-20');
    const row = page.locator('tr[data-candidate]', { hasText: 'AB-CEN-20' }).first();
    await row.waitFor();
    const speed = row.locator('[data-speed-rpm]');
    const rpm = Number(await speed.getAttribute('data-speed-rpm'));
    expect(rpm, 'within its range, below its nominal 2900 rpm').to.be.within(1450, 2899);
    expect(await speed.innerText()).to.equal(`at ${Math.round(rpm)} rpm (${Math.round((100 * rpm) / 2900)} % speed)`);
    await saveScreenshot(page, 'variable-speed-candidates');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('draws its curve at that speed on the comparison chart', async () => {
    const { page } = app;
    // picked by keyboard: a mouse click scrolled to straight from the filter box is sometimes lost (left open)
    const pick = page.locator('tr[data-candidate]', { hasText: 'AB-CEN-20' }).first().locator('mat-checkbox input');
    await pick.focus();
    await page.keyboard.press('Space');
    expect(await pick.isChecked()).to.equal(true);
    await page.getByRole('link', { name: /Compare 1/ }).click();
    const group = page.locator('svg.rf-chart g[data-speed-ratio]');
    await group.waitFor();
    const ratio = Number(await group.getAttribute('data-speed-ratio'));
    const shutOffFt = Number(await group.getAttribute('data-shut-off-head'));
    // the catalog's stored fit at the nominal speed (SI), from the API
    const fetchJson = (path: string) =>
      page.evaluate(
        async ([url, bearer]) => (await fetch(url, { headers: { Authorization: `Bearer ${bearer}` } })).json(),
        [`${app.url}/api/v1${path}`, token] as const,
      );
    const list = await fetchJson('/pumps?search=AB-CEN-20');
    const detail = await fetchJson(`/pumps/${list.items[0].id}`);
    const nominalShutOffM = detail.revision.fit.shutOffHead as number;
    expect(ratio).to.be.within(0.5, 0.999);
    // 1 ft = 0.3048 m exactly; the chart samples the curve from its first published flow, 0 here
    expect(shutOffFt).to.be.closeTo((ratio * ratio * nominalShutOffM) / 0.3048, 0.01);
    expect(await page.locator('.rf-side [data-speed-rpm]').first().innerText()).to.contain('rpm');
    expect(await page.locator('.rf-side thead th').nth(1).innerText()).to.contain(`at ${Math.round(ratio * 2900)} rpm`);
    await saveScreenshot(page, 'variable-speed-comparison');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);

    // the report names the same speed beside the pump it compares
    await page.getByRole('link', { name: 'Next: the report' }).click();
    const reported = page.locator('rf-selection-report-page [data-speed-rpm]').first();
    await reported.waitFor();
    expect(Number(await reported.getAttribute('data-speed-rpm'))).to.be.closeTo(ratio * 2900, 1);
    expect(await reported.innerText()).to.equal(
      `at ${Math.round(ratio * 2900)} rpm (${Math.round(100 * ratio)} % speed)`,
    );
  });
});
