import { expect } from 'chai';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Pump } from '../../server/database/models';
import type { Role } from '../../shared/vocabularies';
import { createUserWithSession, testPassword } from '../support/accounts';
import {
  axeViolations,
  scratchDatabase,
  seriousOrCritical,
  useAppInChromium,
  type AxeViolation,
} from '../support/app-in-chromium';
import { screenshotFolder } from '../support/browser';
import { seedDemoCatalog } from '../data-import/catalog-fixtures';

/*
 * axe-core over every page each role reaches, signed out and signed in: none may break a rule
 * axe rates serious or critical, nor scroll sideways as a whole, at 1,280 px, at 200 % zoom and on a
 * phone. The lesser findings are written to test-results/ to be read.
 */
describe('accessibility of every page in Chromium', function () {
  this.timeout(180_000);
  const app = useAppInChromium(scratchDatabase('accessibility_browser'));
  const emails = new Map<Role, string>();
  let pumpPath = '';
  const lesser: Record<string, AxeViolation[]> = {};

  const designPages = [
    '/design/system',
    '/design/band',
    '/design/candidates',
    '/design/compare',
    '/design/projects',
    '/design/report',
  ];
  const pagesOf = (): Record<Role | 'signed out', string[]> => ({
    'signed out': ['/', '/accounts/sign-in', '/accounts/forgot-password', '/accounts/reset-password?token=unknown'],
    designer: ['/', '/account', ...designPages, '/catalog', pumpPath],
    integrator: ['/', '/account', '/design/system', '/catalog'],
    'supplier-admin': ['/', '/account', '/catalog', pumpPath, '/curve-imports'],
    admin: ['/', '/account', '/admin/users', '/admin/audit-log', '/admin/demo-mailbox', '/curve-imports', '/catalog'],
  });

  before(async () => {
    const [alderbrook] = await seedDemoCatalog(app.sequelize);
    const pump = await Pump.findOne({ where: { supplierId: alderbrook.id }, rejectOnEmpty: true });
    pumpPath = `/catalog/${pump.id}`;
    for (const role of ['designer', 'integrator', 'supplier-admin', 'admin'] as const) {
      const options = role === 'supplier-admin' ? { supplierId: alderbrook.id } : {};
      emails.set(role, (await createUserWithSession(app.sequelize, role, options)).user.email);
    }
  });

  after(() => {
    mkdirSync(screenshotFolder, { recursive: true });
    writeFileSync(join(screenshotFolder, 'accessibility-lesser-findings.json'), `${JSON.stringify(lesser, null, 2)}\n`);
  });

  async function signInAs(role: Role): Promise<void> {
    const { page } = app;
    await page.goto(`${app.url}/accounts/sign-in`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(emails.get(role)!);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
  }

  /**
   * A desktop window, the same window zoomed to 200 % (half its CSS pixels: WCAG 2.2 SC 1.4.4)
   * and a site phone: the toolbar folds its labels away on the narrow ones.
   */
  const viewports = [
    { name: 'desktop', width: 1280, height: 900 },
    { name: 'desktop at 200 %', width: 640, height: 450 },
    { name: 'phone', width: 390, height: 844 },
  ];

  /** The page as a whole scrolls sideways (content lost off the window's edge); wide tables scroll in their own box. */
  async function sidewaysOverflow(where: string): Promise<AxeViolation[]> {
    const overflow = await app.page.evaluate(() => {
      const root = document.documentElement;
      const wide = [...document.querySelectorAll('main *')]
        .filter((element) => element.getBoundingClientRect().right > root.clientWidth + 1)
        .filter((element) => !element.closest('.rf-table-scroll, .rf-chart-numbers-scroll, [role=region][tabindex]'))
        .map(
          (element) =>
            element.tagName.toLowerCase() + (element.className ? `.${String(element.className).split(' ')[0]}` : ''),
        );
      return { by: root.scrollWidth - root.clientWidth, wide: wide.slice(0, 5) };
    });
    return overflow.by > 1
      ? [
          {
            rule: 'reflow',
            impact: 'serious',
            help: `${where}: the page is ${overflow.by} px wider than the window`,
            targets: overflow.wide,
          },
        ]
      : [];
  }

  async function auditPages(who: Role | 'signed out'): Promise<AxeViolation[]> {
    const found: AxeViolation[] = [];
    for (const viewport of viewports) {
      await app.page.setViewportSize(viewport);
      for (const path of pagesOf()[who]) {
        await app.page.goto(`${app.url}${path}`, { waitUntil: 'networkidle' });
        await app.page.locator('main h1, main h2').first().waitFor();
        const violations = await axeViolations(app.page);
        const where = `${who} ${path} (${viewport.name})`;
        lesser[where] = violations.filter((violation) => seriousOrCritical([violation]).length === 0);
        found.push(
          ...seriousOrCritical(violations).map((violation) => ({ ...violation, help: `${where}: ${violation.help}` })),
          ...(await sidewaysOverflow(where)),
        );
      }
    }
    await app.page.setViewportSize(viewports[0]);
    return found;
  }

  it('signed out: the home page and the account forms', async () => {
    expect(await auditPages('signed out')).to.deep.equal([]);
  });

  for (const role of ['designer', 'integrator', 'supplier-admin', 'admin'] as const) {
    it(`signed in as ${role}: every page the role opens`, async () => {
      await app.page.evaluate(() => localStorage.clear());
      await signInAs(role);
      expect(await auditPages(role)).to.deep.equal([]);
    });
  }

  it('checked every page it meant to, each with a result', () => {
    const audited = Object.keys(lesser);
    const meant = Object.entries(pagesOf()).flatMap(([who, paths]) =>
      viewports.flatMap((viewport) => paths.map((path) => `${who} ${path} (${viewport.name})`)),
    );
    expect(audited).to.deep.equal(meant);
  });
});
