import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';
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
