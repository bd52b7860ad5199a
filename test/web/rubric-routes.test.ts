import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, seededApp, signIn } from '../helpers/web.ts';
import { currentRubric, listVersions } from '../../src/store/repos/rubrics.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let app: Awaited<ReturnType<typeof seededApp>>;
let policy: { cookie: string; csrf: string };

beforeAll(async () => {
  store = await factory.open();
  app = await seededApp(store);
  policy = await signIn(app, 'policy');
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

const form = (fields: Record<string, string>, session = policy, htmx = false) => ({
  method: 'POST',
  headers: { cookie: session.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded', 'x-csrf-token': session.csrf, ...(htmx ? { 'hx-request': 'true' } : {}) },
  body: new URLSearchParams(fields),
});

describe('rubric pages', () => {
  it('list the shipped and published rubrics', async () => {
    const html = await (await app.request('/rubrics', { headers: { cookie: policy.cookie } })).text();
    for (const id of ['cairnfield-support', 'general', 'young-readers']) expect(html).toContain(`href="/rubrics/${id}"`);
  });

  it('show a rubric\'s criteria, its file and its history', async () => {
    const html = await (await app.request('/rubrics/cairnfield-support', { headers: { cookie: policy.cookie } })).text();
    expect(html).toContain('trail-safety-caveats');
    expect(html).toContain('shipped with the demo');
    expect(html).toContain('<pre class="source">');
  });

  it('validate a draft as it is typed (htmx fragment) with line and column', async () => {
    const res = await app.request('/rubrics/validate', form({ source: 'id: x\ntitle: X\ncriteria:\n  - id: a\n    check: repitition\n' }, policy, true));
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html.startsWith('<div role="alert">')).toBe(true);
    expect(html).toContain('line 5, column 12');
    expect(html).toContain('did you mean &quot;repetition&quot;?');
  });

  it('refuse to publish a broken draft, show its problems, and keep the version in force', async () => {
    const before = await currentRubric(store.db, 'cairnfield-support');
    const broken = before!.source.replace('check: repetition', 'check: repitition');
    const res = await app.request('/rubrics/cairnfield-support/publish', form({ source: broken, note: 'oops' }));
    expect(res.status).toBe(422);
    const html = await res.text();
    expect(html).toContain('Not published: the draft has 1 problem(s)');
    expect(html).toContain('unknown check &quot;repitition&quot;');
    expect((await currentRubric(store.db, 'cairnfield-support'))!.version).toBe(before!.version);
    expect(await listVersions(store.db, 'cairnfield-support')).toHaveLength(1);
  });

  it('preview a draft\'s impact on a batch, then publish it as a new version with author and note, and diff the two', async () => {
    const before = (await currentRubric(store.db, 'cairnfield-support'))!;
    // the draft drops the safety-caveat criterion's weight to 0: items and bands move
    const draft = before.source.replace(/(id: trail-safety-caveats[\s\S]*?weight: )3/, '$10');
    expect(draft).not.toBe(before.source);
    const batch = await store.db.selectFrom('batches').select('id').executeTakeFirstOrThrow();
    const preview = await app.request('/rubrics/cairnfield-support/preview', form({ source: draft, batch: String(batch.id) }, policy, true));
    expect(preview.status).toBe(200);
    const impact = await preview.text();
    expect(impact).toMatch(/40 items, \d+ responses re-scored/);
    expect(impact).toContain('Agreement of the suggested order with final human rankings');
    expect(impact).toMatch(/Candidates that change band \([1-9]\d*\)/);

    const published = await app.request('/rubrics/cairnfield-support/publish', form({ source: draft, note: 'safety caveats weigh nothing (test)' }));
    expect(published.status).toBe(303);
    const versions = await listVersions(store.db, 'cairnfield-support');
    expect(versions).toHaveLength(2);
    expect(versions[0]).toMatchObject({ author: 'Odile Brannock (demo policy owner)', note: 'safety caveats weigh nothing (test)' });
    const audit = await store.db.selectFrom('audit_events').selectAll().where('kind', '=', 'rubric_publish').execute();
    expect(audit).toHaveLength(1);

    const again = await app.request('/rubrics/cairnfield-support/publish', form({ source: draft, note: 'same again' }));
    expect(again.status).toBe(409);
    expect(await again.text()).toContain('already published');

    const diff = await (await app.request(`/rubrics/cairnfield-support/diff?from=${versions[1].version}&to=${versions[0].version}`, { headers: { cookie: policy.cookie } })).text();
    expect(diff).toContain('<div class="diff-removed">-     weight: 3</div>');
    expect(diff).toContain('<div class="diff-added">+     weight: 0</div>');
  });

  it('load a draft from an uploaded file into the editor', async () => {
    const body = new FormData();
    body.set('_csrf', policy.csrf);
    body.set('file', new File(['id: general\ntitle: Uploaded\ncriteria:\n  - id: a\n    check: format\n'], 'draft.yaml'));
    const res = await app.request('/rubrics/general/upload', { method: 'POST', headers: { cookie: policy.cookie, origin: ORIGIN }, body });
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('title: Uploaded');
    expect(html).toContain('No problems.');
  });

  it('keep editing, preview and publish to the policy role', async () => {
    const reviewer = await signIn(app, 'reviewer');
    expect((await app.request('/rubrics/general/edit', { headers: { cookie: reviewer.cookie } })).status).toBe(403);
    expect((await app.request('/rubrics/validate', form({ source: 'x' }, reviewer, true))).status).toBe(403);
    expect((await app.request('/rubrics/general/publish', form({ source: 'x' }, reviewer))).status).toBe(403);
    const data = await signIn(app, 'data');
    expect((await app.request('/rubrics/general', { headers: { cookie: data.cookie } })).status).toBe(200);
    expect((await app.request('/rubrics/general/edit', { headers: { cookie: data.cookie } })).status).toBe(403);
  });

  it('refuse a publish without its CSRF token', async () => {
    const res = await app.request('/rubrics/general/publish', { method: 'POST', headers: { cookie: policy.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ source: 'x' }) });
    expect(res.status).toBe(403);
  });
});
