import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';

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
