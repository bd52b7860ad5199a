import { describe, expect, it } from 'vitest';
import { migrate } from '../../src/store/migrate.ts';
import { claimNext, submitReview } from '../../src/review/workflow.ts';
import { useSeededApp, signIn } from '../helpers/web.ts';

const fixture = useSeededApp();

/** Item ids the queue page lists, in order. */
async function listed(query: string): Promise<number[]> {
  const { cookie } = await signIn(fixture.app, 'reviewer');
  const res = await fixture.app.request(`/${query}`, { headers: { cookie } });
  expect(res.status).toBe(200);
  const html = await res.text();
  const table = html.slice(html.indexOf('<tbody>'), html.indexOf('</tbody>'));
  return [...table.matchAll(/href="\/items\/(\d+)"/g)].map((m) => Number(m[1]));
}

/** Open items, in queue order, whose responses' scores (read from the findings themselves) pass `keep`. */
async function expected(keep: (scores: { band: string; checks: string[] }[], item: { flag_severity: string | null; batch_id: number }) => boolean): Promise<number[]> {
  const { db } = fixture.store;
  const items = await db.selectFrom('items').select(['id', 'flag_severity', 'batch_id']).where('state', 'in', ['open', 'in_review']).orderBy('priority', 'desc').orderBy('created_at').orderBy('id').execute();
  const scores = await db.selectFrom('scores').innerJoin('responses', 'responses.id', 'scores.response_id').select(['responses.item_id', 'scores.band', 'scores.findings']).execute();
  return items
    .filter((item) => keep(scores.filter((s) => s.item_id === item.id).map((s) => ({ band: s.band, checks: (JSON.parse(s.findings) as { check: string }[]).map((f) => f.check) })), item))
    .slice(0, 50)
    .map((i) => i.id);
}

describe('queue filters', () => {
  it.each([
    ['band=fail', (s: { band: string }[]) => s.some((x) => x.band === 'fail')],
    ['band=review', (s: { band: string }[]) => s.some((x) => x.band === 'review')],
    ['band=pass', (s: { band: string }[]) => s.some((x) => x.band === 'pass')],
    ['check=refusal', (s: { checks: string[] }[]) => s.some((x) => x.checks.includes('refusal'))],
    ['check=personal-data', (s: { checks: string[] }[]) => s.some((x) => x.checks.includes('personal-data'))],
    ['check=certainty&band=review', (s: { band: string; checks: string[] }[]) => s.some((x) => x.checks.includes('certainty')) && s.some((x) => x.band === 'review')],
    ['flagged=1', (_s: unknown, item: { flag_severity: string | null }) => item.flag_severity !== null],
  ])('?%s lists exactly the open items it names, in queue order', async (query, keep) => {
    const want = await expected(keep as never);
    expect(await listed(`?${query}`)).toEqual(want);
  });

  it('lists something for the demo under the band and check filters (the table above is not vacuous)', async () => {
    expect((await listed('?band=fail')).length).toBeGreaterThan(0);
    expect((await listed('?check=refusal')).length).toBeGreaterThan(0);
    expect((await listed('?check=refusal')).length).toBeLessThan((await listed('')).length);
  });

  it('keeps the chosen filters selected in the form', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const html = await (await fixture.app.request('/?band=fail&check=refusal', { headers: { cookie } })).text();
    expect(html).toMatch(/<option value="fail" selected="">/);
    expect(html).toMatch(/<option value="refusal" selected="">/);
    expect(html).toContain('Clear filters');
  });

  it.each([
    ['?band=great', 'band must be one of pass, review, fail, not &quot;great&quot;'],
    ['?check=vibes', 'check must be one of'],
    ['?batch=one', 'batch must be a batch number'],
  ])('refuses %s with a message naming the filter', async (query, message) => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const res = await fixture.app.request(`/${query}`, { headers: { cookie } });
    expect(res.status).toBe(400);
    expect(await res.text()).toContain(message);
  });

  it('shows a submitted review at once: the stored table is not reused once the data under it changed', async () => {
    const { db } = fixture.store;
    const before = await listed('');
    const reviewer = await db.selectFrom('users').select('id').where('username', '=', 'reviewer2').executeTakeFirstOrThrow();
    const claim = (await claimNext(fixture.store, reviewer.id))!;
    const ids = (await db.selectFrom('responses').select('response_id').where('item_id', '=', claim.itemId).execute()).map((r) => r.response_id);
    const ranks = Object.fromEntries(ids.map((id, i) => [id, i + 1]));
    await submitReview(fixture.store, { itemId: claim.itemId, reviewerId: reviewer.id, status: 'submitted', displayOrder: ids, firstRanking: ranks, finalRanking: ranks, rationale: 'The first answers the question; the rest do not.', startedAt: new Date().toISOString(), timeSpentMs: 1000 });
    const item = await db.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.state', 'batches.reviews_required']).where('items.id', '=', claim.itemId).executeTakeFirstOrThrow();
    const after = await listed('');
    if (item.state === 'in_review') {
      const { cookie } = await signIn(fixture.app, 'reviewer');
      const html = await (await fixture.app.request('/', { headers: { cookie } })).text();
      const row = html.slice(html.indexOf(`href="/items/${claim.itemId}"`), html.indexOf('</tr>', html.indexOf(`href="/items/${claim.itemId}"`)));
      expect(row).toContain(`1 of ${item.reviews_required}`);
    } else {
      expect(before).toContain(claim.itemId);
      expect(after).not.toContain(claim.itemId);
    }
  });

  it('the migration that adds the filters fills them in for items scored before it', async () => {
    const { db } = fixture.store;
    const before = await db.selectFrom('items').select(['id', 'score_bands', 'finding_checks']).orderBy('id').execute();
    expect(before.some((i) => i.finding_checks !== ',' && i.finding_checks !== null)).toBe(true);
    await migrate(fixture.store, '0003-login-failures');
    await migrate(fixture.store);
    expect(await db.selectFrom('items').select(['id', 'score_bands', 'finding_checks']).orderBy('id').execute()).toEqual(before);
  });
});
