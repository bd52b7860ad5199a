import { describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { ORIGIN, useSeededApp, signIn } from '../helpers/web.ts';

const fixture = useSeededApp();

async function upload(session: { cookie: string; csrf: string }, content: string, name: string, filename = 'batch.jsonl') {
  const body = new FormData();
  body.set('_csrf', session.csrf);
  body.set('name', name);
  body.set('rubric', 'general');
  body.set('reviews', '2');
  body.set('file', new File([content], filename));
  return fixture.app.request('/batches/import', { method: 'POST', headers: { cookie: session.cookie, origin: ORIGIN }, body });
}

/** Uploads, follows the redirect to the import's page and polls its progress panel until it has finished. */
async function uploadAndWait(session: { cookie: string; csrf: string }, content: string, name: string, filename = 'batch.jsonl') {
  const res = await upload(session, content, name, filename);
  expect(res.status).toBe(303);
  const page = res.headers.get('location')!;
  expect(page).toMatch(/^\/batches\/imports\/[0-9a-f-]{36}$/);
  for (let i = 0; i < 600; i++) {
    const panel = await (await fixture.app.request(`${page}/progress`, { headers: { cookie: session.cookie } })).text();
    if (!panel.includes('hx-trigger')) return { page, panel };
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('the import did not finish');
}

const good = [1, 2, 3].map((i) => JSON.stringify({ prompt_id: `w${i}`, prompt: `Web question ${i}?`, responses: [{ response_id: 'a', text: 'Yes.' }, { response_id: 'b', text: 'No.' }] })).join('\n');

describe('batches from the browser', () => {
  it('imports an uploaded file in the background, scored, and refuses the same file again', async () => {
    const data = await signIn(fixture.app, 'data');
    const { page, panel } = await uploadAndWait(data, good, 'from the web');
    expect(panel).toMatch(/Imported &quot;from the web&quot;: 3 prompts and 6 responses, scored/);
    const full = await fixture.app.request(page, { headers: { cookie: data.cookie } });
    expect(full.status).toBe(200);
    expect(await full.text()).toContain('Import: from the web');
    const again = await uploadAndWait(data, good, 'again');
    expect(again.panel).toContain('was already imported as batch');
  });

  it('shows an import only to whoever started it and to admins', async () => {
    const data = await signIn(fixture.app, 'data');
    const { page } = await uploadAndWait(data, good.replaceAll('Web question', 'Private question'), 'private');
    const admin = await signIn(fixture.app, 'admin');
    expect((await fixture.app.request(page, { headers: { cookie: admin.cookie } })).status).toBe(200);
    expect((await fixture.app.request('/batches/imports/00000000-0000-0000-0000-000000000000', { headers: { cookie: data.cookie } })).status).toBe(404);
  });

  it('lists every bad line of a refused upload and stores nothing', async () => {
    const data = await signIn(fixture.app, 'data');
    const before = Number((await fixture.store.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n);
    const { panel } = await uploadAndWait(data, 'prompt_id,prompt,response_id,response\np,q,a,x\n', 'bad csv', 'bad.csv');
    expect(panel).toContain('Nothing was imported: 1 problem(s) in bad.csv');
    expect(panel).toContain('line 2, responses: has 1 response; a prompt needs 2 to 9 to rank');
    expect(Number((await fixture.store.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n)).toBe(before);
  });

  it('refuses a form without a file or a name before starting anything', async () => {
    const data = await signIn(fixture.app, 'data');
    const res = await upload(data, good, '   ');
    expect(res.status).toBe(422);
    expect(await res.text()).toContain('Give the batch a name.');
  });

  it('streams final decisions as pairs, redacted on request, and records the export', async () => {
    const data = await signIn(fixture.app, 'data');
    const res = await fixture.app.request('/export?format=pairs&redact=1&batch=' + encodeURIComponent('Cairnfield support — flagged week 48'), { headers: { cookie: data.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toContain('plumbline-pairs.jsonl');
    const lines = (await res.text()).trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.length).toBeGreaterThan(50);
    expect(JSON.stringify(lines)).not.toContain('4111 1111 1111 1111');
    const audit = await fixture.store.db.selectFrom('audit_events').select('detail').where('kind', '=', 'export').execute();
    expect(audit.some((a) => JSON.parse(a.detail!).via === 'web')).toBe(true);
  });

  it('is for data engineers and admins', async () => {
    const reviewer = await signIn(fixture.app, 'reviewer');
    expect((await fixture.app.request('/export', { headers: { cookie: reviewer.cookie } })).status).toBe(403);
    expect((await upload(reviewer, good, 'nope')).status).toBe(403);
  });
});
