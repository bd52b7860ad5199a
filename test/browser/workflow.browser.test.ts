import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ARTIFACTS, chromiumAvailable, useBrowserApp } from '../helpers/browser.ts';
import { keyboardReport, seriousAxeViolations } from '../helpers/page-checks.ts';
import { demoPassword } from '../helpers/web.ts';

const batchFile = [1, 2, 3]
  .map((i) => JSON.stringify({ prompt_id: `web-${i}`, prompt: `Can I dry wet boots by the stove, case ${i}?`, responses: [{ response_id: 'a', text: 'Dry them slowly, away from direct heat, with newspaper inside.' }, { response_id: 'b', text: 'Put them right on the stove.' }] }))
  .join('\n');

describe.skipIf(!chromiumAvailable())('the workflow in a real browser (headless Chromium)', () => {
  const app = useBrowserApp(demoPassword);
  const { problems } = app;
  const signedInPage = (username: string) => app.signedInPage(username);

  it('uploads an import and follows its progress until it is stored', async () => {
    const page = await signedInPage('data');
    await page.goto(`${app.server.url}/batches`);
    await page.setInputFiles('#file', { name: 'boots.jsonl', mimeType: 'application/x-ndjson', buffer: Buffer.from(batchFile) });
    await page.fill('#name', 'boots from the browser');
    await Promise.all([page.waitForURL(/\/batches\/imports\/[0-9a-f-]+$/), page.click('form[action="/batches/import"] button[type=submit]')]);
    await page.waitForSelector('text=/Imported "boots from the browser": 3 prompts and 6 responses/', { timeout: 20_000 });
    await page.screenshot({ path: `${ARTIFACTS}import-progress.png`, fullPage: true });
    await page.click('text=Open its queue');
    expect(await page.locator('table.queue tbody tr').count()).toBe(3);
    expect(problems).toEqual([]);
  });

  it('downloads an export of final decisions', async () => {
    const page = await signedInPage('data');
    await page.goto(`${app.server.url}/batches`);
    await page.screenshot({ path: `${ARTIFACTS}batches.png`, fullPage: true });
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('tr', { hasText: 'Cairnfield support' }).locator('a[href^="/export?format=pairs&batch="]').first().click()]);
    expect(download.suggestedFilename()).toBe('plumbline-pairs.jsonl');
    const records = readFileSync((await download.path())!, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(records.length).toBeGreaterThan(0);
    for (const r of records) expect(r.preferred_rank).toBeLessThan(r.other_rank);
    expect(problems).toEqual([]);
  });

  it('adjudicates a disagreement: the item leaves the adjudication queue, decided', async () => {
    const page = await signedInPage('adjudicator');
    await page.goto(`${app.server.url}/adjudicate`);
    const link = page.locator('a[href^="/adjudicate/"]').first();
    const href = (await link.getAttribute('href'))!;
    await link.click();
    await page.waitForURL(`${app.server.url}${href}`);
    await page.screenshot({ path: `${ARTIFACTS}adjudication.png`, fullPage: true });
    await page.fill('#rationale', 'The first candidate answers safely and completely; the rest do not.');
    await Promise.all([page.waitForURL(`${app.server.url}/adjudicate`), page.click('form[action^="/adjudicate/"] button[type=submit]')]);
    expect(await page.locator(`a[href="${href}"]`).count()).toBe(0);
    const itemId = Number(href.split('/').pop());
    const decision = await app.store.db.selectFrom('adjudications').select(['method', 'rationale']).where('item_id', '=', itemId).executeTakeFirstOrThrow();
    expect(decision).toEqual({ method: 'adjudication', rationale: 'The first candidate answers safely and completely; the rest do not.' });
    expect(problems).toEqual([]);
  });

  it('edits a rubric with an error, fixes it, previews the impact and publishes a new version', async () => {
    const page = await signedInPage('policy');
    await page.goto(`${app.server.url}/rubrics/cairnfield-support/edit`);
    const original = await page.inputValue('#source');
    await page.fill('#source', original.replace('check: repetition', 'check: repitition'));
    await page.locator('#source').press('End');
    await page.waitForFunction(() => document.querySelector('#problems')?.textContent?.includes('did you mean'), undefined, { timeout: 10_000 });
    // the fix: the right check name, and a changed title so that it is a new version
    await page.fill('#source', original.replace(/^title: (.*)$/m, 'title: $1 (revised)'));
    await page.locator('#source').press('End');
    await page.waitForFunction(() => !document.querySelector('#problems')?.textContent?.includes('did you mean'), undefined, { timeout: 10_000 });
    await page.click('text=Preview impact');
    await page.waitForFunction(() => (document.querySelector('#impact')?.textContent ?? '').length > 20, undefined, { timeout: 20_000 });
    await page.screenshot({ path: `${ARTIFACTS}rubric-preview.png`, fullPage: true });
    const versionsBefore = await app.store.db.selectFrom('rubric_versions').select('version').where('rubric_id', '=', 'cairnfield-support').execute();
    await page.fill('#note', 'Title says it was revised.');
    await Promise.all([page.waitForURL(`${app.server.url}/rubrics/cairnfield-support`), page.click('text=Publish as a new version')]);
    const versionsAfter = await app.store.db.selectFrom('rubric_versions').select(['version', 'note']).where('rubric_id', '=', 'cairnfield-support').execute();
    expect(versionsAfter).toHaveLength(versionsBefore.length + 1);
    expect(versionsAfter.some((v) => v.note === 'Title says it was revised.')).toBe(true);
    expect(await page.content()).toContain('(revised)');
    expect(problems).toEqual([]);
  });

  /** Every page, for the role that uses it. */
  const PAGES: { name: string; user: string | null; path: string | (() => Promise<string>) }[] = [
    { name: 'login', user: null, path: '/login' },
    { name: 'queue', user: 'reviewer', path: '/' },
    { name: 'queue-filtered', user: 'reviewer', path: '/?band=fail' },
    { name: 'item', user: 'reviewer', path: async () => `/items/${(await app.store.db.selectFrom('items').select('id').orderBy('id').executeTakeFirstOrThrow()).id}` },
    { name: 'review', user: 'reviewer2', path: '/review/next' },
    { name: 'adjudication-queue', user: 'adjudicator', path: '/adjudicate' },
    { name: 'adjudication-item', user: 'adjudicator', path: async () => `/adjudicate/${(await app.store.db.selectFrom('items').select('id').where('state', 'in', ['adjudication', 'escalated']).orderBy('id').executeTakeFirstOrThrow()).id}` },
    { name: 'batches', user: 'data', path: '/batches' },
    { name: 'rubrics', user: 'policy', path: '/rubrics' },
    { name: 'rubric', user: 'policy', path: '/rubrics/general' },
    { name: 'rubric-editor', user: 'policy', path: '/rubrics/general/edit' },
    { name: 'statistics', user: 'admin', path: '/stats?batch=1' },
    { name: 'users', user: 'admin', path: '/admin/users' },
    { name: 'audit', user: 'admin', path: '/admin/audit' },
    { name: 'tokens', user: 'admin', path: '/admin/tokens' },
  ];

  it.each(PAGES)('$name: no serious or critical axe-core violation; every control reachable by Tab, labelled, with visible focus', async ({ name, user, path }) => {
    const page = user ? await signedInPage(user) : await (await app.browser.newContext()).newPage();
    await page.goto(`${app.server.url}${typeof path === 'string' ? path : await path()}`);
    await page.screenshot({ path: `${ARTIFACTS}page-${name}.png`, fullPage: true });
    expect(await seriousAxeViolations(page)).toEqual([]);
    const keyboard = await keyboardReport(page);
    expect(keyboard.reached).toBeGreaterThan(0);
    expect(keyboard.unreachable).toEqual([]);
    expect(keyboard.invisibleFocus).toEqual([]);
    expect(keyboard.unlabelled).toEqual([]);
    await page.context().close();
  });
});
