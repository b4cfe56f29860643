import { expect } from 'chai';
import type { Page } from 'playwright-core';
import { axeViolations, scratchDatabase, seriousOrCritical, useAppInChromium } from '../support/app-in-chromium';
import { createUserWithSession, testPassword } from '../support/accounts';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

/** What the focused element is, for the assertions: its tag, name, text and whether a focus mark shows. */
interface FocusStop {
  tag: string;
  name: string;
  text: string;
  marked: boolean;
}

/** Presses Tab (or Shift+Tab) once and reads the focused element; it is tagged so coverage can be checked. */
async function tab(page: Page, backwards = false): Promise<FocusStop> {
  await page.keyboard.press(backwards ? 'Shift+Tab' : 'Tab');
  return page.evaluate(() => {
    const element = document.activeElement as HTMLElement;
    element.dataset['reachedByTab'] = 'yes';
    const style = getComputedStyle(element);
    // a ring of the element's own, Material's strong focus indicator, or a focused form field's underline
    const indicator = element.querySelector(':scope > .mat-focus-indicator') ?? element;
    const marked =
      (style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) >= 2) ||
      getComputedStyle(indicator, '::before').display !== 'none' ||
      element.closest('.mat-focused') !== null;
    return {
      tag: element.tagName.toLowerCase(),
      name: element.getAttribute('name') ?? element.getAttribute('aria-label') ?? '',
      text: (element.textContent ?? '').trim().replace(/\s+/g, ' '),
      marked,
    };
  });
}

/** Tabs forward until `wanted` holds for the focused element (at most `most` presses). */
async function tabTo(page: Page, wanted: (stop: FocusStop) => boolean, most = 150, backwards = false) {
  const passed: string[] = [];
  for (let press = 0; press < most; press += 1) {
    const stop = await tab(page, backwards);
    if (wanted(stop)) return stop;
    passed.push(`${stop.tag}:${stop.name || stop.text.slice(0, 30)}`);
  }
  throw new Error(`never reached by Tab; passed ${passed.slice(0, 60).join(' | ')}`);
}

/** Tabs through the whole page once, then lists the controls in `main` that Tab never reached. */
async function unreachedControls(page: Page): Promise<string[]> {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  for (let press = 0; press < 250; press += 1) {
    const stop = await tab(page);
    if (stop.tag === 'body') break;
  }
  return page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>('main input, main select, main textarea, main button, main a[href]')]
      .filter(
        (element) =>
          element.checkVisibility({ visibilityProperty: true }) && !element.matches(':disabled, [aria-disabled=true]'),
      )
      // a Material checkbox or radio is reached through its native input, a select through its trigger
      .filter((element) => element.tabIndex >= 0)
      .filter((element) => element.dataset['reachedByTab'] !== 'yes')
      .map((element) => element.getAttribute('name') ?? element.textContent?.trim() ?? element.tagName),
  );
}

/** The focused element is the step's heading, with the step's URL. */
async function focusedHeading(page: Page): Promise<string> {
  return page.evaluate(() => {
    const element = document.activeElement;
    return element?.tagName === 'H2' ? (element.textContent ?? '').trim() : `not a heading: ${element?.tagName}`;
  });
}

/*
 * The design flow by keyboard alone: every control of each step reached by Tab with a focus mark
 * showing, the steps moved through by Enter with the focus put on the new step's heading, the
 * search run, a candidate picked with Space, and the design saved from the dialog.
 */
describe('the design flow by keyboard alone in Chromium', function () {
  this.timeout(180_000);
  const app = useAppInChromium(scratchDatabase('keyboard_flow_browser'));
  let email: string;

  before(async () => {
    await seedSyntheticCatalog(app.sequelize, syntheticShapes(60, 3), 'Keyboard Test Pumps');
    email = (await createUserWithSession(app.sequelize, 'designer')).user.email;
  });

  it('signs in by keyboard', async () => {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in`, { waitUntil: 'networkidle' });
    await tabTo(page, (stop) => stop.name === 'email');
    await page.keyboard.type(email);
    await tab(page);
    await page.keyboard.type(testPassword);
    await page.keyboard.press('Enter');
    await page.locator('a', { hasText: 'Design' }).first().waitFor({ timeout: 10_000 });
  });

  it('reaches every control of the site and system step, each with a focus mark', async () => {
    const { page } = app;
    await page.goto(`${app.url}/design/system`, { waitUntil: 'networkidle' });
    expect(await unreachedControls(page)).to.deep.equal([]);
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    const stops: FocusStop[] = [];
    for (let press = 0; press < 40; press += 1) stops.push(await tab(page));
    const unmarked = stops.filter((stop) => !stop.marked).map((stop) => `${stop.tag} ${stop.name || stop.text}`);
    expect(unmarked).to.deep.equal([]);
  });

  it('changes a length and moves to the flow band by Enter, the focus on its heading', async () => {
    const { page } = app;
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await tabTo(page, (stop) => stop.name === 'length-0');
    await page.keyboard.press('ControlOrMeta+A');
    await page.keyboard.type('240');
    await tabTo(page, (stop) => stop.tag === 'a' && stop.text.startsWith('Next: flow band'));
    await page.keyboard.press('Enter');
    await page.waitForURL(/design\/band/);
    await page.waitForFunction(() => document.activeElement?.tagName === 'H2');
    expect(await focusedHeading(page)).to.equal('Plan the flow');
    expect(await unreachedControls(page)).to.deep.equal([]);
  });

  it('moves to the candidates, runs the search and picks one with Space', async () => {
    const { page } = app;
    await page.locator('h2', { hasText: 'Plan the flow' }).focus();
    await tabTo(page, (stop) => stop.text.startsWith('Next: find candidates'));
    await page.keyboard.press('Enter');
    await page.waitForURL(/design\/candidates/);
    await page.waitForFunction(() => document.activeElement?.tagName === 'H2');
    expect(await focusedHeading(page)).to.equal('Search the catalog');
    await tabTo(page, (stop) => stop.tag === 'button' && stop.text.includes('Find candidates'));
    await page.keyboard.press('Enter');
    await page.locator('tr[data-candidate]').first().waitFor({ timeout: 15_000 });
    expect(await unreachedControls(page)).to.deep.equal([]);
    await page.locator('h2', { hasText: 'Candidates' }).evaluate((heading) => {
      heading.tabIndex = -1;
      heading.focus();
    });
    await tabTo(page, (stop) => stop.tag === 'input' && stop.name.startsWith('Compare '));
    await page.keyboard.press('Space');
    const compare = await tabTo(page, (stop) => stop.tag === 'a' && stop.text.includes('Compare 1'), 150, true);
    expect(compare.marked).to.equal(true);
    await page.keyboard.press('Enter');
    await page.waitForURL(/design\/compare/);
    await page.waitForFunction(() => document.activeElement?.tagName === 'H2');
    expect(await focusedHeading(page)).to.equal('1 candidates on the system curve');
    expect(seriousOrCritical(await axeViolations(page)), 'axe').to.deep.equal([]);
  });

  it('saves the design from the keyboard', async () => {
    const { page } = app;
    await tabTo(page, (stop) => stop.tag === 'button' && stop.text.endsWith('Save'), 40, true);
    await page.keyboard.press('Enter');
    await page.getByRole('dialog').waitFor();
    // the dialog puts the focus in its first field once it has opened
    await page.waitForFunction(() => document.activeElement?.closest('mat-dialog-container') !== null);
    expect(await page.evaluate(() => document.activeElement?.tagName)).to.equal('INPUT');
    await page.keyboard.type('Keyboard-only stream');
    await page.keyboard.press('Enter');
    await page.getByRole('status').filter({ hasText: 'Saved as "Keyboard-only stream"' }).waitFor();
    expect(await page.getByRole('dialog').count()).to.equal(0);
  });
});
