import { expect } from 'chai';
import { smallestConductorForDrop, type CableRun } from '../../shared/electrical';
import { lengthToSI } from '../../shared/hydraulics';
import { CABLE_RUN_CAUTION } from '../../shared/messages/design-cautions';
import { Pump } from '../../server/database/models';
import { axeViolations, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { createUserWithSession } from '../support/accounts';
import { saveScreenshot, signInWithTheForm } from '../support/browser';

/*
 * The cable run in Chromium over the demo catalog: a length typed on the site step gives the
 * report a conductor per pump, the one the engine picks from that pump's catalog rating.
 */
describe('cable run suggestion in Chromium', function () {
  this.timeout(120_000);
  const app = useAppInChromium();
  let email: string;

  before(async () => {
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  it('signs the designer in and types a 150 ft cable run on the site step', async () => {
    const { page } = app;
    await signInWithTheForm(page, app.url, email);
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    await page.getByLabel('Cable run to the pump, one way').fill('-3');
    await page.getByLabel('Cable run to the pump, one way').blur();
    await page.locator('mat-error', { hasText: 'Enter a length above 0' }).waitFor();
    await page.getByLabel('Cable run to the pump, one way').fill('150');
  });

  it('shows each reported pump the conductor the engine picks from its catalog rating, and the caution', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/candidates`, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
    await page.goto(`${app.url}/design/report`, { waitUntil: 'networkidle' });
    const table = page.getByTestId('cable-suggestions');
    await table.waitFor();
    const region = page.getByRole('region', { name: 'Cable run to each pump' }).first();
    expect(await region.innerText()).to.contain('150 ft one way');
    const rows = await table.locator('tbody tr').all();
    expect(rows.length).to.be.greaterThan(0);
    for (const row of rows) {
      const [model, supply, awg, metric] = await row.locator('td').allInnerTexts();
      const pump = await Pump.findOne({ where: { displayName: model } });
      expect(pump, model).to.not.equal(null);
      const run: CableRun = {
        current: pump!.fullLoadCurrentA!,
        voltage: pump!.voltageV!,
        phases: pump!.phaseCount as 1 | 3,
        length: lengthToSI(150, 'ft'),
      };
      expect(supply).to.contain(`${run.voltage} V`);
      expect(awg).to.contain(smallestConductorForDrop('awg', run).conductor.label);
      expect(metric).to.contain(smallestConductorForDrop('metric', run).conductor.label);
    }
    expect(await page.locator('.rf-cable-caution').innerText()).to.contain(CABLE_RUN_CAUTION.title);
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
    await saveScreenshot(page, 'cable-run-report');
  });

  it('asks for the length on the report when the site step has none', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    await page.getByLabel('Cable run to the pump, one way').fill('');
    await page.goto(`${app.url}/design/report`, { waitUntil: 'networkidle' });
    await page.getByText("Enter the cable run's length on step 1").waitFor();
    expect(await page.getByTestId('cable-suggestions').count()).to.equal(0);
  });
});
