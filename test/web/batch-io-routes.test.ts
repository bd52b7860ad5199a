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

const good = [1, 2, 3].map((i) => JSON.stringify({ prompt_id: `w${i}`, prompt: `Web question ${i}?`, responses: [{ response_id: 'a', text: 'Yes.' }, { response_id: 'b', text: 'No.' }] })).join('\n');

describe('batches from the browser', () => {
  it('imports an uploaded file, scored, and refuses the same file again', async () => {
    const data = await signIn(fixture.app, 'data');
    const res = await upload(data, good, 'from the web');
    expect(res.status).toBe(201);
    expect(await res.text()).toMatch(/Imported &quot;from the web&quot;: 3 prompts and 6 responses, scored with general/);
    const again = await upload(data, good, 'again');
    expect(again.status).toBe(409);
    expect(await again.text()).toContain('was already imported as batch');
  });

  it('lists every bad line of a refused upload and stores nothing', async () => {
    const data = await signIn(fixture.app, 'data');
    const before = Number((await fixture.store.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n);
    const res = await upload(data, 'prompt_id,prompt,response_id,response\np,q,a,x\n', 'bad csv', 'bad.csv');
    expect(res.status).toBe(422);
    expect(await res.text()).toContain('line 2, responses: has 1 response; a prompt needs 2 to 9 to rank');
    expect(Number((await fixture.store.db.selectFrom('items').select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n)).toBe(before);
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
