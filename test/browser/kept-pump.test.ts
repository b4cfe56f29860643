import { expect } from 'chai';
import type { SelectionRequest, SelectionResponse } from '../../shared/api/api-schemas';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot, signInWithTheForm } from '../support/browser';
import { createUserWithSession } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/*
 * "Keep an existing pump" in Chromium against the real server and database: the designer finds
 * the installed pump by its model, searches, and reads the set's flow and the kept pump's share.
 */
/** A flow as the page shows it: up to one decimal, no trailing zero (figures under 1,000). */
const shown = (flow: number) => String(Number(flow.toFixed(1)));

describe('keeping an existing pump in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('kept_pump_browser'));
  let email: string;
  let keptId: number;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(120, 11), 'Browser Test Pumps');
    [keptId] = await seedSyntheticCatalog(
      app.sequelize,
      [{ shutOffHead: 12, lastFlow: 0.005, peakEfficiency: 0.6 }],
      'Installed Browser Pumps',
    );
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  it('signs the designer in', async () => {
    const { page } = app;
    await signInWithTheForm(page, app.url, email);
  });

  it('picks the installed pump by model, searches beside it and shows the set', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/candidates`, { waitUntil: 'networkidle' });
    await page.fill('input[name=keptModel]', 'Synthetic pump 1');
    await page.getByRole('button', { name: /Find in the catalog/ }).click();
    const option = page.locator('select[name=keepPumpId] option', { hasText: 'Installed Browser Pumps' });
    await option.waitFor({ state: 'attached' });
    await page.selectOption('select[name=keepPumpId]', { label: (await option.textContent())!.trim() });
    const answered = page.waitForResponse((response) => response.url().endsWith('/api/v1/selections'));
    await page.getByRole('button', { name: /Find candidates/ }).click();
    const response = await answered;
    const sent = response.request().postDataJSON() as SelectionRequest;
    expect(sent.keep).to.deep.equal({ pump: { pumpId: keptId } });
    expect(sent.arrangements).to.deep.equal([1]);
    const answer = (await response.json()) as SelectionResponse;
    const first = answer.candidates[0];
    expect(first.set!.pumps[0].pumpId).to.equal(keptId);
    const row = page.locator('tr[data-candidate]').first();
    await row.waitFor({ timeout: 15_000 });
    expect(await row.textContent()).to.contain('added beside the kept pump');
    // the table's flow is the set's, with the kept pump's share beside it
    const share = (await row.locator('[data-kept-share]').textContent())!.replace(/\s+/g, ' ');
    expect(share).to.contain(`kept ${shown(first.set!.pumps[0].flow)}`);
    expect(share).to.contain(`added ${shown(first.set!.pumps[1].flow)}`);
    expect(await row.textContent()).to.contain(shown(first.set!.flow));
    await saveScreenshot(page, 'kept-pump-candidates');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('keeps the kept pump with the design and shows it by name after a reload', async () => {
    const { page } = app;
    await page.reload({ waitUntil: 'networkidle' });
    const selected = await page
      .locator('select[name=keepPumpId]')
      .evaluate((select: HTMLSelectElement) => select.selectedOptions[0]?.textContent ?? '');
    expect(selected).to.contain('Installed Browser Pumps');
  });
});
