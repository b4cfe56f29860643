import { expect } from 'chai';
import { useAppInChromium } from '../support/app-in-chromium';

/* The toolbar by keyboard and by screen reader, and the app for people who ask for less motion. */
describe('keyboard, names and motion in Chromium', function () {
  this.timeout(60_000);
  const app = useAppInChromium();

  // each test starts on a fresh page, so Tab starts from the top
  beforeEach(async () => {
    await app.page.goto(`${app.url}/`, { waitUntil: 'networkidle' });
  });

  it('reaches the toolbar links with Tab, in order, each named by its label alone', async () => {
    const { page } = app;
    const reached: string[] = [];
    for (let press = 0; press < 3; press += 1) {
      await page.keyboard.press('Tab');
      reached.push(await page.evaluate(() => document.activeElement?.textContent?.trim() ?? ''));
    }
    expect(reached[0]).to.equal('Riffle');
    // the icon's ligature ("water", "code") is hidden from the accessibility tree
    const toolbar = page.getByRole('navigation', { name: 'Main' });
    expect(await toolbar.getByRole('link', { name: 'Overview', exact: true }).count()).to.equal(1);
    expect(await toolbar.getByRole('link', { name: 'API reference', exact: true }).count()).to.equal(1);
    expect(await page.getByRole('link', { name: /^water/ }).count()).to.equal(0);
  });

  it('shows where the keyboard focus is on the dark toolbar', async () => {
    const { page } = app;
    const overview = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Overview' });
    await page.mouse.move(0, 0);
    const bar = page.locator('.rf-toolbar');
    const unfocused = await bar.screenshot({ animations: 'disabled' });
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    expect(await overview.evaluate((link) => link === document.activeElement)).to.equal(true);
    const ring = await overview.evaluate((link) => {
      const style = getComputedStyle(link);
      return { style: style.outlineStyle, width: parseFloat(style.outlineWidth), colour: style.outlineColor };
    });
    expect(ring.style).to.equal('solid');
    expect(ring.width).to.be.at.least(2);
    // the light ring on the dark bar (limestone #f4efe6)
    expect(ring.colour).to.equal('rgb(244, 239, 230)');
    const focused = await bar.screenshot({ animations: 'disabled' });
    expect(focused.equals(unfocused)).to.equal(false);
  });

  it('ends transitions at once when the system asks for reduced motion', async () => {
    const { page } = app;
    // the sign-in form's floating labels move with a transition
    await page.goto(`${app.url}/accounts/sign-in`, { waitUntil: 'networkidle' });
    const longestTransition = () =>
      page.evaluate(() =>
        Math.max(
          ...[...document.querySelectorAll('main *')].map((element) =>
            Math.max(
              ...getComputedStyle(element)
                .transitionDuration.split(',')
                .map((part) => parseFloat(part)),
            ),
          ),
        ),
      );
    await page.emulateMedia({ reducedMotion: 'no-preference' });
    const usual = await longestTransition();
    await page.emulateMedia({ reducedMotion: 'reduce' });
    try {
      expect(usual).to.be.above(0.05);
      expect(await longestTransition()).to.be.below(0.001);
    } finally {
      await page.emulateMedia({ reducedMotion: 'no-preference' });
    }
  });
});
