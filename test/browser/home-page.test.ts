import { expect } from 'chai';
import { useAppInChromium } from '../support/app-in-chromium';
import { saveScreenshot } from '../support/browser';

describe('home page in Chromium', function () {
  this.timeout(60_000);
  const app = useAppInChromium();

  before(async () => {
    await app.page.goto(`${app.url}/`, { waitUntil: 'networkidle' });
  });

  it('has the product title and says what Riffle does', async () => {
    expect(await app.page.title()).to.equal('Riffle');
    expect(await app.page.locator('h1').textContent()).to.contain('Pumps that run where they should');
  });

  it('really loaded Lato and the icon font that ship with the app', async () => {
    const fonts = await app.page.evaluate(async () => {
      await document.fonts.ready;
      return { lato: document.fonts.check('16px Lato'), icons: document.fonts.check('24px "Material Icons"') };
    });
    expect(fonts).to.deep.equal({ lato: true, icons: true });
    const loadedFaces = await app.page.evaluate(() =>
      [...document.fonts].filter((face) => face.status === 'loaded').map((face) => face.family),
    );
    expect(loadedFaces.map((family) => family.replaceAll('"', ''))).to.include.members(['Lato', 'Material Icons']);
  });

  it('shows the live service status from the API', async () => {
    await app.page.locator('.rf-status', { hasText: 'database up' }).waitFor({ timeout: 10_000 });
  });

  it('made no request that left loopback, and a screenshot is saved', async () => {
    const path = await saveScreenshot(app.page, 'home-page');
    expect(path).to.match(/home-page\.png$/);
    expect(app.browser.offLoopbackRequests).to.deep.equal([]);
  });
});
