import axe from 'axe-core';
import type { Page } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../../server/database/connection';
import { initialiseModels } from '../../server/database/models';
import { openBrowser, type BrowserOptions, type BrowserSession } from './browser';
import { createScratchDatabase, testDatabaseConfig } from './test-database';
import { startTestServer } from './test-server';

export interface AppInChromium {
  /** The app's address, e.g. http://127.0.0.1:41234. */
  url: string;
  browser: BrowserSession;
  page: Page;
  sequelize: Sequelize;
}

interface OpenDatabase {
  sequelize: Sequelize;
  close: () => Promise<void>;
}

/** The database `npm test` migrated and seeded with the demo data. */
async function openSeededTestDatabase(): Promise<OpenDatabase> {
  const sequelize = createSequelize(testDatabaseConfig());
  initialiseModels(sequelize);
  return { sequelize, close: () => sequelize.close() };
}

/** A suite's own empty, migrated database, dropped afterwards. */
export function scratchDatabase(label: string): () => Promise<OpenDatabase> {
  return async () => {
    const { sequelize, drop } = await createScratchDatabase(label);
    return { sequelize, close: drop };
  };
}

/**
 * Hooks for the calling describe: before its tests, the app (with the built client) on a free
 * loopback port over the seeded test database or `openDatabase`, and a fresh Debian Chromium;
 * after them, all closed. The fields are filled in when the `before` hook has run.
 */
export function useAppInChromium(
  openDatabase: () => Promise<OpenDatabase> = openSeededTestDatabase,
  browserOptions: BrowserOptions = {},
): AppInChromium {
  const fixture = {} as AppInChromium;
  let database: OpenDatabase | undefined;
  let server: Awaited<ReturnType<typeof startTestServer>> | undefined;

  before(async () => {
    database = await openDatabase();
    server = await startTestServer(database.sequelize);
    const browser = await openBrowser(browserOptions);
    Object.assign(fixture, { url: server.url, browser, page: browser.page, sequelize: database.sequelize });
  });

  after(async () => {
    await fixture.browser?.close();
    await server?.close();
    await database?.close();
  });

  return fixture;
}

/** One axe rule a page breaks, with the elements that break it. */
export interface AxeViolation {
  rule: string;
  impact: string;
  help: string;
  /** CSS selectors of the offending elements. */
  targets: string[];
}

/**
 * Runs axe-core inside the page as it stands (WCAG 2.1 A and AA rules and axe's best practices).
 * The source goes in through the DevTools protocol, which the app's content security policy does
 * not govern, so the page under test keeps its real policy.
 */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  await page.evaluate(axe.source);
  return page.evaluate(async () => {
    const { axe: inPage } = window as unknown as { axe: typeof axe };
    const results = await inPage.run(document, { resultTypes: ['violations'] });
    return results.violations.map((violation) => ({
      rule: violation.id,
      impact: violation.impact ?? 'unknown',
      help: violation.help,
      targets: violation.nodes.map((node) => node.target.join(' ')),
    }));
  });
}

/** The violations axe rates serious or critical: a page must have none. */
export function seriousOrCritical(violations: readonly AxeViolation[]): AxeViolation[] {
  return violations.filter((violation) => violation.impact === 'serious' || violation.impact === 'critical');
}
