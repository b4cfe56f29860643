import { expect } from 'chai';
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../../server/database/connection';
import { initialiseModels } from '../../server/database/models';
import { openBrowser, saveScreenshot, type BrowserSession } from '../support/browser';
import { testDatabaseConfig } from '../support/test-database';
import { startTestServer } from '../support/test-server';

describe('home page in Chromium', function () {
  this.timeout(60_000);
  let sequelize: Sequelize;
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;

  before(async () => {
    sequelize = createSequelize(testDatabaseConfig());
    initialiseModels(sequelize);
    server = await startTestServer(sequelize);
    browser = await openBrowser();
    await browser.page.goto(`${server.url}/`, { waitUntil: 'networkidle' });
  });

  after(async () => {
    await browser?.close();
    await server?.close();
    await sequelize?.close();
  });

  it('has the product title and says what Riffle does', async () => {
    expect(await browser.page.title()).to.equal('Riffle');
    expect(await browser.page.locator('h1').textContent()).to.contain('Pumps that run where they should');
  });

  it('really loaded Lato and the icon font that ship with the app', async () => {
    const fonts = await browser.page.evaluate(async () => {
      await document.fonts.ready;
      return { lato: document.fonts.check('16px Lato'), icons: document.fonts.check('24px "Material Icons"') };
    });
    expect(fonts).to.deep.equal({ lato: true, icons: true });
    const loadedFaces = await browser.page.evaluate(() => [...document.fonts].filter((face) => face.status === 'loaded').map((face) => face.family));
    expect(loadedFaces.map((family) => family.replaceAll('"', ''))).to.include.members(['Lato', 'Material Icons']);
  });

  it('shows the live service status from the API', async () => {
    await browser.page.locator('.rf-status', { hasText: 'database up' }).waitFor({ timeout: 10_000 });
  });

  it('made no request that left loopback, and a screenshot is saved', async () => {
    const path = await saveScreenshot(browser.page, 'home-page');
    expect(path).to.match(/home-page\.png$/);
    expect(browser.offLoopbackRequests).to.deep.equal([]);
  });
});
