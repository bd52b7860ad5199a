import { describe, expect, it } from 'vitest';
import { ARTIFACTS, chromiumAvailable, useBrowserApp } from '../helpers/browser.ts';
import { demoPassword } from '../helpers/web.ts';

describe.skipIf(!chromiumAvailable())('pages in a real browser (headless Chromium)', () => {
  const app = useBrowserApp(demoPassword);
  const { problems } = app;
  const signedInPage = (username: string) => app.signedInPage(username);

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
    await page.goto(`${app.server.url}/rubrics/cairnfield-support/edit`);
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
    await page.goto(`${app.server.url}/stats?batch=1`);
    expect(await page.locator('svg[role=img]').count()).toBeGreaterThanOrEqual(3);
    await page.screenshot({ path: `${ARTIFACTS}statistics.png`, fullPage: true });
    await page.goto(`${app.server.url}/admin/audit`);
    expect(await page.locator('table tbody tr').count()).toBeGreaterThan(0);
    await page.screenshot({ path: `${ARTIFACTS}audit.png`, fullPage: true });
    expect(problems).toEqual([]);
  });
});
