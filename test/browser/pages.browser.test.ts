import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { chromiumAvailable, startBrowserApp } from '../helpers/browser.ts';
import { demoPassword } from '../helpers/web.ts';
import type { RunningServer } from '../../src/web/server.ts';
import type { Store } from '../../src/store/connect.ts';

const ARTIFACTS = new URL('../../test-artifacts/', import.meta.url).pathname;

describe.skipIf(!chromiumAvailable())('pages in a real browser (headless Chromium)', () => {
  let store: Store;
  let server: RunningServer;
  let browser: Browser;
  let close: () => Promise<void>;
  const problems: string[] = [];

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    ({ store, server, browser, close } = await startBrowserApp(demoPassword));
  }, 60_000);
  afterAll(async () => {
    await close?.();
  });

  async function signedInPage(username: string): Promise<Page> {
    const page = await browser.newPage();
    page.on('console', (m) => { if (m.type() === 'error') problems.push(`${username} console: ${m.text()}`); });
    page.on('pageerror', (e) => problems.push(`${username} page error: ${e.message}`));
    await page.goto(`${server.url}/login`);
    await page.fill('#username', username);
    await page.fill('#password', demoPassword(username));
    await Promise.all([page.waitForURL(`${server.url}/`), page.click('button[type=submit]')]);
    return page;
  }

  it('signs in and shows the triage queue, with no console errors or CSP violations', async () => {
    const page = await signedInPage('reviewer');
    await expect(page.locator('h1').textContent()).resolves.toBe('Review queue');
    expect(await page.locator('table.queue tbody tr').count()).toBeGreaterThan(10);
    expect(await page.evaluate(() => typeof (window as unknown as { htmx?: unknown }).htmx)).toBe('object');
    await page.screenshot({ path: `${ARTIFACTS}queue.png`, fullPage: true });
    expect(problems).toEqual([]);
  });

  it('validates a rubric draft as it is typed (htmx with the CSRF header, under the CSP)', async () => {
    const page = await signedInPage('policy');
    await page.goto(`${server.url}/rubrics/cairnfield-support/edit`);
    const source = await page.inputValue('#source');
    await page.fill('#source', source.replace('check: repetition', 'check: repitition'));
    await page.locator('#source').press('End');
    await page.waitForFunction(() => document.querySelector('#problems')?.textContent?.includes('did you mean'), undefined, { timeout: 10_000 });
    expect(await page.locator('#problems').textContent()).toMatch(/line \d+, column \d+ unknown check "repitition"/);
    await page.screenshot({ path: `${ARTIFACTS}rubric-editor.png`, fullPage: true });
    expect(problems).toEqual([]);
  });

  it('renders the statistics charts and the audit log', async () => {
    const page = await signedInPage('admin');
    await page.goto(`${server.url}/stats?batch=1`);
    expect(await page.locator('svg[role=img]').count()).toBeGreaterThanOrEqual(3);
    await page.screenshot({ path: `${ARTIFACTS}statistics.png`, fullPage: true });
    await page.goto(`${server.url}/admin/audit`);
    expect(await page.locator('table tbody tr').count()).toBeGreaterThan(0);
    await page.screenshot({ path: `${ARTIFACTS}audit.png`, fullPage: true });
    expect(problems).toEqual([]);
  });
});
