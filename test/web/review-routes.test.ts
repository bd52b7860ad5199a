import { describe, expect, it } from 'vitest';
import { ORIGIN, useSeededApp, signIn } from '../helpers/web.ts';

const fixture = useSeededApp();

const post = (session: { cookie: string; csrf: string }, path: string, fields: Record<string, string>) =>
  fixture.app.request(path, { method: 'POST', headers: { cookie: session.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: session.csrf, ...fields }) });

function formFields(html: string): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const m of html.matchAll(/<input[^>]*name="([^"]+)"[^>]*value="([^"]*)"/g)) fields[m[1]] = m[2].replace(/&quot;/g, '"').replace(/&amp;/g, '&');
  return fields;
}

describe('reviewing an item: blind first, then reveal, revise and submit', () => {
  it('claims the next item and shows it without scores or findings', async () => {
    const reviewer = await signIn(fixture.app, 'reviewer');
    const next = await fixture.app.request('/review/next', { headers: { cookie: reviewer.cookie } });
    expect(next.status).toBe(303);
    const path = next.headers.get('location')!;
    expect(path).toMatch(/^\/review\/\d+$/);
    const html = await (await fixture.app.request(path, { headers: { cookie: reviewer.cookie } })).text();
    expect(html).toContain('Scores and findings stay hidden until you commit this first ranking');
    expect(html).not.toMatch(/suggested \d/);
    expect(html).not.toContain('<mark');
    expect(html).toContain('Candidate A');
  });

  it('refuses to reveal before every candidate has a valid rank, then reveals, logs it, and stores both rankings on submit', async () => {
    const reviewer = await signIn(fixture.app, 'reviewer');
    const path = (await fixture.app.request('/review/next', { headers: { cookie: reviewer.cookie } })).headers.get('location')!;
    const itemId = Number(path.split('/').pop());
    const blind = await (await fixture.app.request(path, { headers: { cookie: reviewer.cookie } })).text();
    const fields = formFields(blind);
    const order = fields.order.split(',');
    const bad = await post(reviewer, `${path}/reveal`, { ...fields, [`rank_${order[0]}`]: '9' });
    expect(bad.status).toBe(422);
    expect(await bad.text()).toMatch(/Not revealed: rank of \w must be a whole number from 1 to \d/);

    const firstRanks = Object.fromEntries(order.map((id, i) => [`rank_${id}`, String(i + 1)]));
    const revealed = await post(reviewer, `${path}/reveal`, { ...fields, ...firstRanks });
    expect(revealed.status).toBe(200);
    const revealedHtml = await revealed.text();
    expect(revealedHtml).toMatch(/suggested \d/);
    expect(revealedHtml).toContain('Your first ranking is saved');
    expect((await fixture.store.db.selectFrom('audit_events').select('kind').where('kind', '=', 'reveal').execute()).length).toBe(1);

    const after = formFields(revealedHtml);
    const revised = { ...firstRanks, [`rank_${order[0]}`]: '2', [`rank_${order[1]}`]: '1' };
    const noRationale = await post(reviewer, `${path}/submit`, { ...after, ...revised, rationale: 'short' });
    expect(noRationale.status).toBe(422);
    expect(await noRationale.text()).toMatch(/Not submitted: write a rationale of at least 20 characters/);
    const done = await post(reviewer, `${path}/submit`, { ...after, ...revised, rationale: 'The second candidate answers the question fully and safely.' });
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toBe('/review/next');
    const stored = await fixture.store.db.selectFrom('reviews').selectAll().where('item_id', '=', itemId).where('status', '=', 'submitted').orderBy('id', 'desc').executeTakeFirstOrThrow();
    expect(JSON.parse(stored.display_order)).toEqual(order);
    expect(JSON.parse(stored.first_ranking!)[order[0]]).toBe(1);
    expect(JSON.parse(stored.final_ranking!)[order[0]]).toBe(2);
    expect(stored.revealed_at).not.toBeNull();
    expect(stored.time_spent_ms).toBeGreaterThanOrEqual(0);
  });

  it('lets a reviewer skip with a reason, without penalty', async () => {
    const reviewer2 = await signIn(fixture.app, 'reviewer2');
    const path = (await fixture.app.request('/review/next', { headers: { cookie: reviewer2.cookie } })).headers.get('location')!;
    const fields = formFields(await (await fixture.app.request(path, { headers: { cookie: reviewer2.cookie } })).text());
    const noReason = await post(reviewer2, `${path}/skip`, { order: fields.order, started_at: fields.started_at, action: 'skip', reason: '' });
    expect(noReason.status).toBe(422);
    const skipped = await post(reviewer2, `${path}/skip`, { order: fields.order, started_at: fields.started_at, action: 'skip', reason: 'need a break' });
    expect(skipped.status).toBe(303);
    const next = (await fixture.app.request('/review/next', { headers: { cookie: reviewer2.cookie } })).headers.get('location');
    expect(next).not.toBe(path);
  });

  it('renders hostile model text as text on the review page', async () => {
    const reviewer = await signIn(fixture.app, 'adjudicator');
    const path = (await fixture.app.request('/review/next', { headers: { cookie: reviewer.cookie } })).headers.get('location')!;
    const itemId = Number(path.split('/').pop());
    const row = await fixture.store.db.selectFrom('responses').select('id').where('item_id', '=', itemId).executeTakeFirstOrThrow();
    await fixture.store.db.updateTable('responses').set({ text: '<script>alert(1)</script><svg onload=alert(2)>\u200Bhidden' }).where('id', '=', row.id).execute();
    const html = await (await fixture.app.request(path, { headers: { cookie: reviewer.cookie } })).text();
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;&lt;svg onload=alert(2)&gt;⟦U+200B⟧hidden');
    expect(html).not.toContain('<script>alert');
  });

  it('keeps review pages from people without the reviewer role, and needs a live claim', async () => {
    const policy = await signIn(fixture.app, 'policy');
    expect((await fixture.app.request('/review/next', { headers: { cookie: policy.cookie } })).status).toBe(403);
    const reviewer2 = await signIn(fixture.app, 'reviewer2');
    const me = await fixture.store.db.selectFrom('users').select('id').where('username', '=', 'reviewer2').executeTakeFirstOrThrow();
    const mine = (await fixture.store.db.selectFrom('work_claims').select('item_id').where('user_id', '=', me.id).execute()).map((c) => c.item_id);
    const someoneElses = await fixture.store.db.selectFrom('work_claims').select('item_id').where('user_id', '!=', me.id).where('item_id', 'not in', mine.length ? mine : [-1]).executeTakeFirstOrThrow();
    const res = await fixture.app.request(`/review/${someoneElses.item_id}`, { headers: { cookie: reviewer2.cookie } });
    expect(res.status).toBe(409);
    expect(await res.text()).toContain('You do not hold this item');
  });
});

describe('exposure', () => {
  it('suggests a break at the soft daily limit, and lets the reviewer go on', async () => {
    const previous = process.env.PLUMBLINE_DAILY_LIMIT;
    process.env.PLUMBLINE_DAILY_LIMIT = '1';
    try {
      const reviewer = await signIn(fixture.app, 'reviewer');
      const res = await fixture.app.request('/review/next', { headers: { cookie: reviewer.cookie } });
      expect(res.status).toBe(200);
      expect(await res.text()).toMatch(/You have reviewed \d+ items today; the suggested limit is 1/);
      const goOn = await fixture.app.request('/review/next?continue=1', { headers: { cookie: reviewer.cookie } });
      expect([303, 200]).toContain(goOn.status);
      expect(await goOn.text()).not.toContain('Time for a break?');
    } finally {
      if (previous === undefined) delete process.env.PLUMBLINE_DAILY_LIMIT;
      else process.env.PLUMBLINE_DAILY_LIMIT = previous;
    }
  });
});
