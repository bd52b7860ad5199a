import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { chromiumAvailable, startBrowserApp } from '../helpers/browser.ts';
import { demoPassword } from '../helpers/web.ts';
import type { RunningServer } from '../../src/web/server.ts';
import type { Store } from '../../src/store/connect.ts';

const ARTIFACTS = new URL('../../test-artifacts/', import.meta.url).pathname;

describe.skipIf(!chromiumAvailable())('reviewing in a real browser (headless Chromium)', () => {
  let store: Store;
  let server: RunningServer;
  let browser: Browser;
  let close: () => Promise<void>;
  let page: Page;
  const problems: string[] = [];

  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true });
    ({ store, server, browser, close } = await startBrowserApp(demoPassword));
    // tall enough that every candidate is on screen: native drag and drop needs source and target visible
    page = await browser.newPage({ viewport: { width: 1280, height: 3200 } });
    page.on('console', (m) => { if (m.type() === 'error') problems.push(m.text()); });
    page.on('pageerror', (e) => problems.push(e.message));
    await page.goto(`${server.url}/login`);
    await page.fill('#username', 'reviewer');
    await page.fill('#password', demoPassword('reviewer'));
    await Promise.all([page.waitForURL(`${server.url}/`), page.click('button[type=submit]')]);
  }, 60_000);
  afterAll(async () => {
    await close?.();
  });

  it('ranks by keyboard and by drag, reveals, shows a hidden passage, revises and submits', async () => {
    await page.click('a[href="/review/next"]');
    await page.waitForURL(/\/review\/\d+$/);
    const itemId = Number(page.url().split('/').pop());
    const ids = await page.$$eval('li.candidate', (lis) => lis.map((li) => (li as HTMLElement).dataset.response!));
    expect(ids.length).toBeGreaterThanOrEqual(4);
    expect(await page.locator('text=/suggested \\d/').count()).toBe(0); // blind

    // keyboard: focus the first rank field, clear it and type a digit; ArrowUp raises a rank
    const firstRank = page.locator(`#rank-${ids[0]}`);
    await firstRank.focus();
    await page.keyboard.press('Control+A');
    await page.keyboard.type('2');
    const secondRank = page.locator(`#rank-${ids[1]}`);
    await secondRank.focus();
    await page.keyboard.press('Control+A');
    await page.keyboard.type('2');
    await page.keyboard.press('ArrowDown'); // 2 → 1
    expect(await secondRank.inputValue()).toBe('1');

    // drag: move the last candidate to the top; ranks renumber in the new order
    await page.dragAndDrop(`li.candidate[data-response="${ids[ids.length - 1]}"]`, `li.candidate[data-response="${ids[0]}"]`, { targetPosition: { x: 20, y: 5 } });
    const afterDrag = await page.$$eval('li.candidate', (lis) => lis.map((li) => [(li as HTMLElement).dataset.response, (li.querySelector('input.rank') as HTMLInputElement).value]));
    expect(afterDrag[0]).toEqual([ids[ids.length - 1], '1']);
    expect(afterDrag.map(([, rank]) => rank)).toEqual(ids.map((_, i) => String(i + 1)));
    await page.screenshot({ path: `${ARTIFACTS}review-blind.png`, fullPage: true });

    await Promise.all([page.waitForURL(/\/reveal$/), page.click('button:has-text("Commit first ranking")')]);
    expect(await page.locator('text=/suggested \\d/').count()).toBeGreaterThan(0);
    const masked = page.locator('.finding.masked').first();
    if (await masked.count()) {
      await masked.focus();
      await page.keyboard.press('Enter');
      await expect.poll(async () => (await store.db.selectFrom('audit_events').select('kind').where('kind', '=', 'unmask').execute()).length).toBeGreaterThan(0);
    }
    await page.screenshot({ path: `${ARTIFACTS}review-revealed.png`, fullPage: true });

    // revise: swap the first two places, write the rationale, submit
    const order = await page.$$eval('li.candidate', (lis) => lis.map((li) => (li as HTMLElement).dataset.response!));
    await page.fill(`#rank-${order[0]}`, '2');
    await page.fill(`#rank-${order[1]}`, '1');
    await page.fill('#rationale', 'After the reveal the second candidate is clearly safer and complete.');
    await Promise.all([page.waitForURL(/\/review\/(next|\d+)$/), page.click('button:has-text("Submit ranking")')]);
    const stored = await store.db.selectFrom('reviews').selectAll().where('item_id', '=', itemId).orderBy('id', 'desc').executeTakeFirstOrThrow();
    const first = JSON.parse(stored.first_ranking!);
    const final = JSON.parse(stored.final_ranking!);
    expect(first[ids[ids.length - 1]]).toBe(1);
    expect(final[order[1]]).toBe(1);
    expect(stored.revealed_at).not.toBeNull();
    expect(problems).toEqual([]);
  });
});
