/*
 * Client benchmark: the built app in Debian's Chromium against the real server on loopback, over a
 * scratch MariaDB of its own with 400 invented pumps. Prints, per route, the bytes sent on a cold
 * load (all, and JavaScript alone) and the JavaScript a design step fetches when reached from the
 * step before; then, with the CPU slowed 4x (a site phone), first and largest contentful paint per
 * route and the time from "Find candidates" to the results on screen, each against the home page
 * in the same run. Prints figures only; asserts nothing.
 *
 * Run: npm run bench:client
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { CDPSession, Page } from 'playwright-core';
import { createApp, defaultClientFolder } from '../../server/app';
import { createSequelize } from '../../server/database/connection';
import { createMigrator } from '../../server/database/migrator';
import { initialiseModels } from '../../server/database/models';
import { PrivateMariaDb } from '../../server/database/private-mariadb';
import { ensureClientBuilt } from '../../server/launch/client-build';
import { createLogger } from '../../server/logging';
import { createUserWithSession, testPassword } from '../support/accounts';
import { openBrowser } from '../support/browser';
import { freeLoopbackPort } from '../support/free-port';
import { seedSyntheticCatalog, syntheticShapes } from '../server/selection/synthetic-catalog';

const CPU_SLOWDOWN = 4;
const RUNS = 5;
const routes = ['/', '/accounts/sign-in', '/design/system', '/design/band', '/design/candidates', '/catalog'];
const designSteps = ['/design/system', '/design/band', '/design/candidates', '/design/compare', '/design/report'];

interface Transfer {
  /** Everything on the wire, response headers included. */
  all: number;
  /** Scripts on the wire, headers included. */
  script: number;
  /** Script bodies alone, as sent (compressed). */
  scriptBody: number;
}

/** Bytes on the wire (headers and compressed bodies) of every response the page gets while `action` runs. */
async function transferred(cdp: CDPSession, action: () => Promise<void>): Promise<Transfer> {
  const types = new Map<string, string>();
  const total: Transfer = { all: 0, script: 0, scriptBody: 0 };
  const onResponse = (event: { requestId: string; type: string; response: { headers: Record<string, string> } }) => {
    types.set(event.requestId, event.type);
    const length = Object.entries(event.response.headers).find(([name]) => name.toLowerCase() === 'content-length');
    if (event.type === 'Script') total.scriptBody += Number(length?.[1] ?? 0);
  };
  const onFinished = (event: { requestId: string; encodedDataLength: number }) => {
    total.all += event.encodedDataLength;
    if (types.get(event.requestId) === 'Script') total.script += event.encodedDataLength;
  };
  cdp.on('Network.responseReceived', onResponse);
  cdp.on('Network.loadingFinished', onFinished);
  try {
    await action();
  } finally {
    cdp.off('Network.responseReceived', onResponse);
    cdp.off('Network.loadingFinished', onFinished);
  }
  return total;
}

/** First and largest contentful paint of the page just loaded, in ms from navigation start. */
function paints(page: Page): Promise<{ fcp: number; lcp: number }> {
  return page.evaluate(
    () =>
      new Promise<{ fcp: number; lcp: number }>((resolve) => {
        const fcp = performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? Number.NaN;
        new PerformanceObserver((list) => {
          const entries = list.getEntries();
          resolve({ fcp, lcp: entries[entries.length - 1].startTime });
        }).observe({ type: 'largest-contentful-paint', buffered: true });
      }),
  );
}

/** From the click on "Find candidates" to the frame after the first result row appears, timed inside the page. */
function searchTime(page: Page): Promise<number> {
  return page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        const button = [...document.querySelectorAll('button')].find((b) => b.textContent?.includes('Find candidates'));
        const observer = new MutationObserver(() => {
          if (!document.querySelector('tr[data-candidate]')) return;
          observer.disconnect();
          requestAnimationFrame(() => resolve(performance.now() - started));
        });
        observer.observe(document.body, { childList: true, subtree: true });
        const started = performance.now();
        button!.click();
      }),
  );
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const kib = (bytes: number) => `${(bytes / 1024).toFixed(1).padStart(6)} KiB`;
const ms = (value: number) => `${value.toFixed(0).padStart(5)} ms`;

/** The design the selection flow builds: 14.5 ft static head, 240 ft of 3" PVC, 100 to 130 gpm. */
async function fillDesign(page: Page, url: string): Promise<void> {
  await page.goto(`${url}/design/system`, { waitUntil: 'networkidle' });
  await page.fill('input[name=staticHead]', '14.5');
  await page.fill('input[name=length-0]', '240');
  await page.getByRole('link', { name: /Next: flow band/ }).click();
  await page.getByText('Pond turnover').click();
  await page.fill('input[name=volume]', '6000');
  await page.fill('input[name=turnoversMin]', '1');
  await page.fill('input[name=turnoversMax]', '1.3');
  await page.getByRole('button', { name: /Use as the duty band/ }).click();
  await page.getByRole('button', { name: /Next: find candidates/ }).click();
  await page.waitForURL(/design\/candidates/);
}

async function main(): Promise<void> {
  await ensureClientBuilt((line) => console.log(line));
  const folder = mkdtempSync(join(tmpdir(), 'riffle-bench-client-'));
  const databasePort = await freeLoopbackPort();
  const database = await PrivateMariaDb.startOrReuse({ folder: join(folder, 'mariadb'), port: databasePort });
  await database.ensureDatabase('riffle_bench');
  const sequelize = createSequelize({
    host: '127.0.0.1',
    port: databasePort,
    name: 'riffle_bench',
    user: 'root',
    password: '',
  });
  const server = createServer(
    createApp({ sequelize, logger: createLogger('silent'), clientFolder: defaultClientFolder }),
  );
  const browser = await openBrowser();
  try {
    initialiseModels(sequelize);
    await createMigrator(sequelize).up();
    await seedSyntheticCatalog(sequelize, syntheticShapes(400, 11), 'Benchmark Pumps (invented)');
    const { user } = await createUserWithSession(sequelize, 'designer');
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const { page } = browser;
    const cdp = await browser.context.newCDPSession(page);
    await cdp.send('Network.enable');

    await page.goto(`${url}/accounts/sign-in`, { waitUntil: 'networkidle' });
    await page.getByLabel('E-mail address').fill(user.email);
    await page.getByLabel('Password').fill(testPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();
    await fillDesign(page, url);

    console.log('\nbytes on the wire, cold cache, signed in as a designer (brotli where the file has a copy)');
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
    for (const route of routes) {
      const load = await transferred(cdp, () =>
        page.goto(`${url}${route}`, { waitUntil: 'networkidle' }).then(() => {}),
      );
      console.log(
        `${route.padEnd(22)} all ${kib(load.all)}   JavaScript ${kib(load.script)}, of which bodies ${kib(load.scriptBody)}`,
      );
    }
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: false });

    console.log(
      '\nJavaScript a design step fetches when reached from the step before (from the home page for the first)',
    );
    // the cold loads above left every chunk in the cache: each step's chunks are fetched afresh
    await cdp.send('Network.clearBrowserCache');
    await page.goto(`${url}/`, { waitUntil: 'networkidle' });
    let previousLink = page.getByRole('link', { name: 'Design', exact: true });
    for (const step of designSteps) {
      const link = previousLink;
      const load = await transferred(cdp, async () => {
        await link.click();
        await page.waitForURL(`${url}${step}`);
        await page.waitForLoadState('networkidle');
      });
      console.log(`${step.padEnd(22)} JavaScript ${kib(load.script)}, of which bodies ${kib(load.scriptBody)}`);
      previousLink = page.locator(`a[href="${designSteps[designSteps.indexOf(step) + 1]}"]`).first();
    }

    await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
    console.log(`\nCPU slowed ${CPU_SLOWDOWN}x, median of ${RUNS} loads each, warm HTTP cache`);
    const figures = new Map<string, { fcp: number; lcp: number }>();
    for (const route of routes) {
      const runs: Array<{ fcp: number; lcp: number }> = [];
      for (let run = 0; run < RUNS; run += 1) {
        await page.goto(`${url}${route}`, { waitUntil: 'networkidle' });
        runs.push(await paints(page));
      }
      figures.set(route, { fcp: median(runs.map((r) => r.fcp)), lcp: median(runs.map((r) => r.lcp)) });
    }
    const home = figures.get('/')!;
    for (const [route, { fcp, lcp }] of figures) {
      console.log(
        `${route.padEnd(22)} FCP ${ms(fcp)} (${(fcp / home.fcp).toFixed(2)} x home)   LCP ${ms(lcp)} (${(lcp / home.lcp).toFixed(2)} x home)`,
      );
    }

    const searches: number[] = [];
    for (let run = 0; run < RUNS; run += 1) {
      // the draft keeps the last results; without them the page waits for the click
      await page.evaluate(() => {
        const key = 'riffle.design-draft.v1';
        const draft = JSON.parse(sessionStorage.getItem(key) ?? '{}') as { results?: unknown };
        sessionStorage.setItem(key, JSON.stringify({ ...draft, results: null }));
      });
      await page.goto(`${url}/design/candidates`, { waitUntil: 'networkidle' });
      searches.push(await searchTime(page));
    }
    const search = median(searches);
    console.log(
      `"Find candidates" to results on screen (400 pumps, 1 to 3 in parallel): ${ms(search)} median of ${RUNS} (${(search / home.lcp).toFixed(2)} x the home page's LCP)`,
    );
  } finally {
    await browser.close();
    if (server.listening) await new Promise((resolve) => server.close(resolve));
    await sequelize.close();
    await database.stop();
    rmSync(folder, { recursive: true, force: true });
  }
}

await main();
