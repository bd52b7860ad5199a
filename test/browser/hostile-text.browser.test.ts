import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { chromiumAvailable, launchChromium } from '../helpers/browser.ts';
import { sqliteFactory } from '../helpers/stores.ts';
import { INJECTION_VECTORS } from '../fixtures/injection-vectors.ts';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { insertReview, setItemState } from '../../src/store/repos/reviews.ts';
import { publishRubric, currentRubric } from '../../src/store/repos/rubrics.ts';
import { loadRubric } from '../../src/rubric/load.ts';
import { startServer, type RunningServer } from '../../src/web/server.ts';
import type { Store } from '../../src/store/connect.ts';

const PASSWORD = 'hostile-test-pw-1';

describe.skipIf(!chromiumAvailable())('hostile text is shown as text on every page (headless Chromium)', () => {
  const factory = sqliteFactory();
  let store: Store;
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  let firstItem = 0;
  let adjudicationItem = 0;
  const dialogs: string[] = [];
  const offsite: string[] = [];
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    expect(INJECTION_VECTORS.length).toBeGreaterThanOrEqual(40);
    store = await factory.open();
    await migrate(store);
    await seedDemo(store.db, { password: () => 'demo-pw-unused-1' });
    const userId = await createUser(store.db, { username: 'mallory', displayName: '<img src=x onerror=alert("name")>\u202Eeman', password: PASSWORD, roles: ['reviewer', 'adjudicator', 'policy', 'data', 'admin'] });
    const other = await createUser(store.db, { username: 'trent', displayName: '<script>alert("trent")</script>', password: PASSWORD, roles: ['reviewer'] });
    const { itemIds } = await storeBatch(store.db, {
      name: '<script>alert("batch")</script>',
      sourceHash: 'hostile',
      sourceName: '<svg onload=alert("source")>',
      reviewsRequired: 2,
      items: INJECTION_VECTORS.map((v, i) => ({
        promptId: `p${i}<b>`,
        prompt: v,
        flag: { reason: INJECTION_VECTORS[(i + 3) % INJECTION_VECTORS.length].slice(0, 200), severity: 'critical' },
        responses: [
          { responseId: 'a"><i>', text: v },
          { responseId: 'b', text: INJECTION_VECTORS[(i + 1) % INJECTION_VECTORS.length] },
        ],
        priority: 5000 - i,
      })),
    });
    firstItem = itemIds[0];
    adjudicationItem = itemIds[1];
    for (const [who, ranking, rationale] of [[userId, { 'a"><i>': 1, b: 2 }, INJECTION_VECTORS[0]], [other, { 'a"><i>': 2, b: 1 }, INJECTION_VECTORS[1]]] as const) {
      await insertReview(store.db, { itemId: adjudicationItem, reviewerId: who, status: 'submitted', displayOrder: ['b', 'a"><i>'], firstRanking: ranking, finalRanking: ranking, rationale, startedAt: new Date().toISOString(), timeSpentMs: 1 });
    }
    await setItemState(store.db, adjudicationItem, 'adjudication');
    const general = (await currentRubric(store.db, 'general'))!;
    await publishRubric(store.db, 'general', loadRubric(general.source.replace('title: General assistant answers', 'title: General assistant answers (edited)')).rubric!, userId, '<img src=x onerror=alert("note")> note');

    server = await startServer(store, { host: '127.0.0.1', port: 0 });
    browser = await launchChromium();
    page = await browser.newPage();
    page.on('dialog', async (d) => {
      dialogs.push(d.message());
      await d.dismiss();
    });
    page.on('request', (r) => {
      if (!r.url().startsWith(server.url) && !r.url().startsWith('data:')) offsite.push(r.url());
    });
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
    await page.goto(`${server.url}/login`);
    await page.fill('#username', 'mallory');
    await page.fill('#password', PASSWORD);
    await Promise.all([page.waitForURL(`${server.url}/`), page.click('button[type=submit]')]);
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.close();
    await store?.close();
    await factory.cleanup();
  });

  /** What a page holds that only injected markup could have put there. */
  async function injected(): Promise<string[]> {
    return page.evaluate(() => {
      const found: string[] = [];
      const scripts = [...document.querySelectorAll('script')].map((s) => s.getAttribute('src'));
      if (scripts.some((src) => src !== '/static/htmx.min.js' && src !== '/static/plumbline.js')) found.push(`script ${scripts.join(',')}`);
      for (const el of document.querySelectorAll('*')) {
        for (const attr of el.attributes) {
          if (/^on/i.test(attr.name) || /^hx-on/i.test(attr.name)) found.push(`${el.tagName} ${attr.name}`);
          if (/javascript:/i.test(attr.value)) found.push(`${el.tagName} ${attr.name}=javascript:`);
        }
      }
      for (const sel of ['img', 'iframe', 'object', 'embed', 'base', 'meta[http-equiv]', 'video', 'marquee', 'details', 'template', 'math', 'plaintext', 'x', 'svg:not([role=img])', 'style', 'link[rel=stylesheet]:not([href="/static/plumbline.css"])']) {
        const n = document.querySelectorAll(sel).length;
        if (n) found.push(`${n} × ${sel}`);
      }
      return found;
    });
  }

  const pages = () => [
    '/',
    `/items/${firstItem}`,
    `/items/${adjudicationItem}`,
    '/review/next',
    '/adjudicate',
    `/adjudicate/${adjudicationItem}`,
    '/batches',
    '/stats',
    '/rubrics',
    '/rubrics/general',
    '/admin/audit',
    '/admin/tokens',
  ];

  it('visits every page that shows user-supplied text: no dialog, no injected element, no request off-site, no console error', async () => {
    for (const path of pages()) {
      await page.goto(`${server.url}${path}`);
      await page.waitForLoadState('networkidle');
      expect(await injected(), path).toEqual([]);
    }
    // the review page after the reveal shows the findings' evidence too
    await page.goto(`${server.url}/review/next`);
    if (/\/review\/\d+$/.test(page.url())) {
      await Promise.all([page.waitForURL(/\/reveal$/), page.click('button:has-text("Commit first ranking")')]);
      expect(await injected(), 'revealed review page').toEqual([]);
    }
    expect(dialogs).toEqual([]);
    expect(offsite).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });

  it('shows the text itself, escaped, with bidi and zero-width characters made visible', async () => {
    await page.goto(`${server.url}/items/${firstItem}`);
    const text = await page.locator('.untrusted.prompt').textContent();
    expect(text).toBe('<script>alert(1)</script>');
    await page.goto(`${server.url}/`);
    expect(await page.locator('body').textContent()).toContain('<script>alert("batch")</script>');
    const bidiItem = INJECTION_VECTORS.findIndex((v) => v.includes('\u202E'));
    const row = await store.db.selectFrom('items').select('id').where('prompt_id', '=', `p${bidiItem}<b>`).executeTakeFirstOrThrow();
    await page.goto(`${server.url}/items/${row.id}`);
    expect(await page.locator('.untrusted.prompt').textContent()).toBe('order ⟦U+202E⟧evil⟦U+202C⟧ reversed');
  });
});
