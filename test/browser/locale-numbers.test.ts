import { expect } from 'chai';
import { signInWithTheForm } from '../support/browser';
import { scratchDatabase, useAppInChromium } from '../support/app-in-chromium';
import { createUserWithSession } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/*
 * A designer whose browser reads German: figures shown with a decimal comma, fields that take a
 * comma or a point alike, units beside them as in English, and the search's answer the same pumps.
 */
describe('figures in a German browser', function () {
  this.timeout(120_000);
  const app = useAppInChromium(scratchDatabase('locale_browser'), { locale: 'de-DE' });
  let email: string;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(60, 3), 'Locale Test Pumps');
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  it('signs in', async () => {
    const { page } = app;
    await signInWithTheForm(page, app.url, email);
  });

  it('shows the typed static head with a decimal comma and takes a comma or a point', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    expect(await page.locator('input[name=staticHead]').inputValue()).to.equal('14,5');
    await page.fill('input[name=staticHead]', '16,25');
    await page.locator('input[name=staticHead]').blur();
    await page.locator('[role=status]', { hasText: 'TDH' }).waitFor();
    // the comma was read as a decimal mark: 16.25 ft, kept as a number in the draft
    const stored = await page.evaluate(() => Object.values(sessionStorage).join(' '));
    expect(stored).to.contain('"staticHead":16.25');
    await page.fill('input[name=staticHead]', '16.5');
    await page.locator('input[name=staticHead]').blur();
    await page.waitForFunction(() => Object.values(sessionStorage).join(' ').includes('"staticHead":16.5'));
    // text that is no number is refused at the field, not sent
    await page.fill('input[name=staticHead]', '16,5 ft');
    await page.locator('input[name=staticHead]').blur();
    expect(await page.locator('input[name=staticHead]').getAttribute('aria-invalid')).to.equal('true');
    await page.fill('input[name=staticHead]', '14,5');
  });

  it('shows the candidates with decimal commas and the units beside them', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/candidates`, { waitUntil: 'networkidle' });
    expect(await page.locator('.rf-context').innerText()).to.match(/Duty band 90 to 130 gpm/);
    await page.getByRole('button', { name: /Find candidates/ }).click();
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
    const heads = await page.locator('tr[data-candidate] td.mat-column-head').allInnerTexts();
    expect(heads.length).to.be.greaterThan(0);
    expect(heads.every((head) => /^\d+,\d$/.test(head.trim()))).to.equal(true);
    expect(await page.locator('th.mat-column-head').innerText()).to.contain('(ft)');
  });
});
