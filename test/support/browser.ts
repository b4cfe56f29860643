import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { projectRoot } from '../../server/config';
import { testPassword } from './accounts';

export const screenshotFolder = join(projectRoot, 'test-results');

/** Flags that keep Debian's Chromium quiet on a machine with no network beyond loopback. */
const chromiumFlags = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface BrowserSession {
  page: Page;
  context: BrowserContext;
  /** Every request the page made to a host other than loopback. */
  offLoopbackRequests: string[];
  close: () => Promise<void>;
}

function isLoopback(url: string): boolean {
  const { protocol, hostname } = new URL(url);
  if (protocol === 'data:' || protocol === 'blob:' || protocol === 'about:') return true;
  return hostname === '127.0.0.1' || hostname === 'localhost' || hostname === '[::1]';
}

/** What a suite may ask of its browser: the language its user reads (default Chromium's own, en-US). */
export interface BrowserOptions {
  locale?: string;
}

/** Debian's Chromium (never a downloaded one) with a fresh profile. */
export async function openBrowser(options: BrowserOptions = {}): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'riffle-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    args: chromiumFlags,
    viewport: { width: 1280, height: 900 },
    ...(options.locale ? { locale: options.locale } : {}),
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const offLoopbackRequests: string[] = [];
  context.on('request', (request) => {
    if (!isLoopback(request.url())) offLoopbackRequests.push(request.url());
  });
  return {
    page,
    context,
    offLoopbackRequests,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function saveScreenshot(page: Page, name: string): Promise<string> {
  mkdirSync(screenshotFolder, { recursive: true });
  const path = join(screenshotFolder, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** Signs a user in through the sign-in form with the tests' password, and waits for the signed-in toolbar. */
export async function signInWithTheForm(page: Page, appUrl: string, email: string): Promise<void> {
  await page.goto(`${appUrl}/accounts/sign-in`, { waitUntil: 'networkidle' });
  await page.fill('input[name=email]', email);
  await page.fill('input[name=password]', testPassword);
  await page.click('button[type=submit]');
  await page.locator('a', { hasText: 'Design' }).first().waitFor({ timeout: 10_000 });
}
