import { existsSync, mkdirSync } from 'node:fs';
import { afterAll, beforeAll } from 'vitest';
import { chromium, type Browser, type Page } from 'playwright-core';
import { seedDemo } from '../../src/demo/seed.ts';
import type { Store } from '../../src/store/connect.ts';
import { migrate } from '../../src/store/migrate.ts';
import { startServer, type RunningServer } from '../../src/web/server.ts';
import { sqliteFactory } from './stores.ts';

export const CHROMIUM = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/**
 * Whether Debian's Chromium is installed. Browser suites skip, saying so, when it is not — and
 * with CI=true they fail instead (`.ci/run` installs it with apt-get).
 */
export function chromiumAvailable(): boolean {
  const available = existsSync(CHROMIUM);
  if (!available && process.env.CI === 'true') throw new Error(`CI=true but ${CHROMIUM} is missing: install Debian's chromium (apt-get install -y chromium) — browser tests must not be skipped in CI`);
  if (!available) console.warn(`[plumbline tests] ${CHROMIUM} not found: browser tests are SKIPPED. Install it with: apt-get install -y chromium`);
  return available;
}

/** Headless Chromium from Debian, driven by playwright-core; never a downloaded browser. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: CHROMIUM, args: FLAGS, headless: true });
}

/**
 * A demo-seeded SQLite store, the app serving it on 127.0.0.1 and a headless Chromium, for one
 * browser test file; `close()` stops all three and removes the store.
 */
export async function startBrowserApp(password: (username: string) => string): Promise<{ store: Store; server: RunningServer; browser: Browser; close(): Promise<void> }> {
  const factory = sqliteFactory();
  const store = await factory.open();
  await migrate(store);
  await seedDemo(store.db, { password });
  const server = await startServer(store, { host: '127.0.0.1', port: 0 });
  const browser = await launchChromium();
  return {
    store,
    server,
    browser,
    async close() {
      await browser.close();
      await server.close();
      await store.close();
      await factory.cleanup();
    },
  };
}

/**
 * A browser-app fixture for one test file (see startBrowserApp), with sign-in through the login
 * form and a list of console errors and page errors seen on any page, which tests expect empty.
 */
export function useBrowserApp(password: (username: string) => string): {
  store: Store;
  server: RunningServer;
  browser: Browser;
  problems: string[];
  signedInPage(username: string, options?: { viewport?: { width: number; height: number } }): Promise<Page>;
} {
  const fixture = { problems: [] as string[] } as ReturnType<typeof useBrowserApp>;
  let close: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    const started = await startBrowserApp(password);
    ({ store: fixture.store, server: fixture.server, browser: fixture.browser } = started);
    close = started.close;
  }, 60_000);
  afterAll(async () => {
    await close?.();
  });
  fixture.signedInPage = async (username, options = {}) => {
    const context = await fixture.browser.newContext({ acceptDownloads: true, viewport: options.viewport });
    const page = await context.newPage();
    page.on('console', (m) => { if (m.type() === 'error') fixture.problems.push(`${username} console: ${m.text()}`); });
    page.on('pageerror', (e) => fixture.problems.push(`${username} page error: ${e.message}`));
    await page.goto(`${fixture.server.url}/login`);
    await page.fill('#username', username);
    await page.fill('#password', password(username));
    await Promise.all([page.waitForURL(`${fixture.server.url}/`), page.click('button[type=submit]')]);
    return page;
  };
  return fixture;
}

/** Where browser tests save their screenshots. */
export const ARTIFACTS = new URL('../../test-artifacts/', import.meta.url).pathname;
