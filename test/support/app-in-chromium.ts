import type { Page } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { createSequelize } from '../../server/database/connection';
import { initialiseModels } from '../../server/database/models';
import { openBrowser, type BrowserSession } from './browser';
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
export function useAppInChromium(openDatabase: () => Promise<OpenDatabase> = openSeededTestDatabase): AppInChromium {
  const fixture = {} as AppInChromium;
  let database: OpenDatabase | undefined;
  let server: Awaited<ReturnType<typeof startTestServer>> | undefined;

  before(async () => {
    database = await openDatabase();
    server = await startTestServer(database.sequelize);
    const browser = await openBrowser();
    Object.assign(fixture, { url: server.url, browser, page: browser.page, sequelize: database.sequelize });
  });

  after(async () => {
    await fixture.browser?.close();
    await server?.close();
    await database?.close();
  });

  return fixture;
}
