import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { currentRubric } from '../../src/store/repos/rubrics.ts';
import { runCli } from '../helpers/cli.ts';
import { ORIGIN, signIn, useSeededApp } from '../helpers/web.ts';

/**
 * One batch from upload to export through the web app, as its users work: a data engineer
 * uploads it; two demo reviewers rank every item blind, reveal and submit, disagreeing on some;
 * the adjudicator decides those; the export is read back and every field checked against
 * expectations worked out by hand below (not by the code under test).
 */
const fixture = useSeededApp();
const BATCH = 'end to end';
const R1 = 'Clear, complete and safe; the others miss the point.';
const R2 = 'Ordered by how directly each one answers the question.';

type Ranks = Record<string, number>;
interface Case {
  id: string;
  prompt: string;
  texts: Record<string, string>;
  first: Ranks; // demo reviewer 1
  second: Ranks; // demo reviewer 2
  decidedBy: 'consensus' | 'adjudication';
  final: Ranks;
  agreement: number; // share of pairs both order alike, worked by hand
  rationale?: string; // the adjudicator's
}

const CASES: Case[] = [
  { id: 'e1', prompt: 'How long should stream water boil?', texts: { a: 'One minute at a rolling boil.', b: 'A while.', c: 'Never boil it.' },
    first: { a: 1, b: 2, c: 3 }, second: { a: 1, b: 2, c: 3 }, decidedBy: 'consensus', final: { a: 1, b: 2, c: 3 }, agreement: 1 },
  // same first choice, b and c swapped: mean ranks a 1, b 2.5, c 2.5, d 4 → b and c tie; 5 of 6 pairs alike
  { id: 'e2', prompt: 'Which tent suits four people?', texts: { a: 'The four-person dome.', b: 'Any tent.', c: 'A two-person tent, twice.', d: 'No tent.' },
    first: { a: 1, b: 2, c: 3, d: 4 }, second: { a: 1, b: 3, c: 2, d: 4 }, decidedBy: 'consensus', final: { a: 1, b: 2, c: 2, d: 4 }, agreement: 0.833 },
  // opposite orders: no pair alike
  { id: 'e3', prompt: 'Can I return worn boots?', texts: { a: 'Yes, within 30 days.', b: 'No returns at all.' },
    first: { a: 1, b: 2 }, second: { a: 2, b: 1 }, decidedBy: 'adjudication', final: { a: 1, b: 2 }, agreement: 0, rationale: 'The returns policy allows 30 days for worn boots.' },
  // both tie a and b first: the same set of first choices
  { id: 'e4', prompt: 'Is the blue or the green pack lighter?', texts: { a: 'They weigh the same.', b: 'Both are 1.2 kg.', c: 'The red one.' },
    first: { a: 1, b: 1, c: 3 }, second: { a: 1, b: 1, c: 3 }, decidedBy: 'consensus', final: { a: 1, b: 1, c: 3 }, agreement: 1 },
  // c>a>b against a>c>b: a/c differ, a/b and c/b alike → 2 of 3
  { id: 'e5', prompt: 'What card is on my account?', texts: { a: 'I cannot share card details here.', b: 'It is 4111 1111 1111 1111.', c: 'Please check your account page.' },
    first: { c: 1, a: 2, b: 3 }, second: { a: 1, c: 2, b: 3 }, decidedBy: 'adjudication', final: { a: 1, c: 2, b: 3 }, agreement: 0.667, rationale: 'A refuses to read out card data; B leaks a full number.' },
];

const fileText = CASES.map((c) => JSON.stringify({ prompt_id: c.id, prompt: c.prompt, responses: Object.entries(c.texts).map(([response_id, text]) => ({ response_id, text })) })).join('\n');

/** Pairs the export must hold: every unordered pair of responses, ties included. */
const allPairs = CASES.reduce((n, c) => n + (Object.keys(c.texts).length * (Object.keys(c.texts).length - 1)) / 2, 0);
const tiedPairs = 2; // e2 (b, c) and e4 (a, b)

async function post(session: { cookie: string; csrf: string }, path: string, fields: Record<string, string>) {
  return fixture.app.request(path, { method: 'POST', headers: { cookie: session.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ _csrf: session.csrf, ...fields }) });
}

const rankFields = (ranks: Ranks) => Object.fromEntries(Object.entries(ranks).map(([id, r]) => [`rank_${id}`, String(r)]));

/** One reviewer works the queue until it is empty: rank blind, reveal, keep the ranking, submit. */
async function reviewAll(username: string, ranksFor: (c: Case) => Ranks, rationale: string): Promise<string[]> {
  const session = await signIn(fixture.app, username);
  const done: string[] = [];
  for (;;) {
    const next = await fixture.app.request('/review/next', { headers: { cookie: session.cookie } });
    if (next.status !== 303) break;
    const path = next.headers.get('location')!;
    const page = await (await fixture.app.request(path, { headers: { cookie: session.cookie } })).text();
    const promptId = CASES.find((c) => page.includes(c.prompt))!.id;
    const ranks = ranksFor(CASES.find((c) => c.id === promptId)!);
    const startedAt = page.match(/name="started_at" value="([^"]+)"/)![1];
    const revealed = await post(session, `${path}/reveal`, { ...rankFields(ranks), started_at: startedAt });
    expect(revealed.status).toBe(200);
    const submitted = await post(session, `${path}/submit`, { ...rankFields(ranks), first: JSON.stringify(ranks), rationale, started_at: startedAt });
    expect(submitted.status, await submitted.clone().text()).toBe(303);
    done.push(promptId);
  }
  return done;
}

describe('from upload to export', () => {
  it('imports, reviews twice with disagreements, adjudicates, and exports every pair with every field right', async () => {
    const { db } = fixture.store;
    // the demo's own open work is set aside, so the queue holds only this batch
    await db.updateTable('items').set({ state: 'escalated' }).where('state', 'in', ['open', 'in_review']).execute();
    const started = new Date().toISOString();

    // 1. upload
    const data = await signIn(fixture.app, 'data');
    const body = new FormData();
    for (const [k, v] of Object.entries({ _csrf: data.csrf, name: BATCH, rubric: 'general', reviews: '2', rationale_min: '25' })) body.set(k, v);
    body.set('file', new File([fileText], 'end-to-end.jsonl'));
    const upload = await fixture.app.request('/batches/import', { method: 'POST', headers: { cookie: data.cookie, origin: ORIGIN }, body });
    expect(upload.status).toBe(303);
    let panel = '';
    for (let i = 0; i < 400 && !panel.includes('Imported'); i++) {
      await new Promise((r) => setTimeout(r, 25));
      panel = await (await fixture.app.request(`${upload.headers.get('location')}/progress`, { headers: { cookie: data.cookie } })).text();
    }
    expect(panel).toContain(`Imported &quot;${BATCH}&quot;: 5 prompts and 15 responses, scored.`);

    // 2. two reviewers, every item; a rationale under the batch's 25 characters is refused
    const short = await signIn(fixture.app, 'reviewer');
    const claimed = (await fixture.app.request('/review/next', { headers: { cookie: short.cookie } })).headers.get('location')!;
    const claimedPage = await (await fixture.app.request(claimed, { headers: { cookie: short.cookie } })).text();
    const claimedCase = CASES.find((c) => claimedPage.includes(c.prompt))!;
    const refused = await post(short, `${claimed}/submit`, { ...rankFields(claimedCase.first), rationale: 'Too short to count.', started_at: started });
    expect(refused.status).toBe(422);
    expect(await refused.text()).toContain('at least 25 characters');
    expect((await reviewAll('reviewer', (c) => c.first, R1)).sort()).toEqual(CASES.map((c) => c.id));
    expect((await reviewAll('reviewer2', (c) => c.second, R2)).sort()).toEqual(CASES.map((c) => c.id));

    // 3. the adjudicator decides the disagreements, and only those wait for a decision
    const adjudicator = await signIn(fixture.app, 'adjudicator');
    const queue = await (await fixture.app.request('/adjudicate', { headers: { cookie: adjudicator.cookie } })).text();
    const items = await db.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.id', 'items.prompt_id', 'items.state']).where('batches.name', '=', BATCH).execute();
    for (const c of CASES) {
      const item = items.find((i) => i.prompt_id === c.id)!;
      expect(item.state, c.id).toBe(c.decidedBy === 'consensus' ? 'final' : 'adjudication');
      expect(queue.includes(`href="/adjudicate/${item.id}"`), c.id).toBe(c.decidedBy === 'adjudication');
      if (c.decidedBy !== 'adjudication') continue;
      const decided = await post(adjudicator, `/adjudicate/${item.id}`, { ...rankFields(c.final), rationale: c.rationale! });
      expect(decided.status).toBe(303);
    }

    // 4. export: pairs, with and without ties, read back whole
    const exported = async (ties: boolean) => {
      const res = await fixture.app.request(`/export?format=pairs&batch=${encodeURIComponent(BATCH)}${ties ? '&ties=1' : ''}`, { headers: { cookie: data.cookie } });
      expect(res.status).toBe(200);
      return (await res.text()).trim().split('\n').map((l) => JSON.parse(l));
    };
    const withTies = await exported(true);
    const withoutTies = await exported(false);
    expect(withTies).toHaveLength(allPairs); // Σ K(K−1)/2 = 3 + 6 + 1 + 3 + 3 = 16
    expect(withoutTies).toHaveLength(allPairs - tiedPairs);
    expect(withoutTies).toEqual(withTies.filter((p) => !p.tie));

    const rubric = await currentRubric(db, 'general');
    const reviewerIds = withTies[0].reviewer_ids;
    expect(reviewerIds).toHaveLength(2);
    for (const id of reviewerIds) expect(id).toMatch(/^rv_[0-9a-f]{12}$/);
    for (const record of withTies) {
      const c = CASES.find((x) => x.id === record.prompt_id)!;
      expect(Object.keys(record).sort()).toEqual(['batch', 'decided_at', 'decided_by', 'other_id', 'other_rank', 'other_text', 'preferred_id', 'preferred_rank', 'preferred_text', 'prompt', 'prompt_id', 'rationale', 'reviewer_agreement', 'reviewer_count', 'reviewer_ids', 'rubric_id', 'rubric_version', 'tie']);
      expect(record.batch).toBe(BATCH);
      expect(record.prompt).toBe(c.prompt);
      expect(record.preferred_text).toBe(c.texts[record.preferred_id]);
      expect(record.other_text).toBe(c.texts[record.other_id]);
      expect(record.preferred_rank).toBe(c.final[record.preferred_id]);
      expect(record.other_rank).toBe(c.final[record.other_id]);
      expect(record.preferred_rank).toBeLessThanOrEqual(record.other_rank);
      expect(record.tie).toBe(record.preferred_rank === record.other_rank);
      expect(record.decided_by).toBe(c.decidedBy);
      expect(record.decided_at >= started).toBe(true);
      expect(record.reviewer_count).toBe(2);
      expect(record.reviewer_ids).toEqual(reviewerIds);
      expect(record.reviewer_agreement).toBe(c.agreement);
      expect(record.rubric_id).toBe('general');
      expect(record.rubric_version).toBe(rubric!.version);
      expect(record.rationale).toBe(c.decidedBy === 'adjudication' ? c.rationale : `reviewers agreed (pairwise agreement ${Math.round(c.agreement * 100)}%)`);
    }
    // every unordered pair of every item, once
    for (const c of CASES) {
      const ids = Object.keys(c.texts);
      const seen = withTies.filter((p) => p.prompt_id === c.id).map((p) => [p.preferred_id, p.other_id].sort().join('|')).sort();
      expect(seen).toEqual(ids.flatMap((a, i) => ids.slice(i + 1).map((b) => [a, b].sort().join('|'))).sort());
    }

    // 5. the CLI export of the same store writes the same pairs and a data card beside them
    const out = join(fixture.store.where, '..', 'e2e-pairs.jsonl');
    const cli = runCli(['export', '--format', 'pairs', '--batch', BATCH, '--include-ties', '--out', out], { env: { PLUMBLINE_DB: fixture.store.where } });
    expect(cli.code, cli.stderr).toBe(0);
    expect(readFileSync(out, 'utf8').trim().split('\n').map((l) => JSON.parse(l))).toEqual(withTies);
    const card = readFileSync(out.replace(/\.jsonl$/, '.card.md'), 'utf8');
    expect(card).toContain('- Decided items: 5 (3 by reviewer consensus, 2 by adjudication), 15 responses.');
    expect(card).toContain(`- Pairs: ${allPairs - tiedPairs} strictly ordered and ${tiedPairs} tied`);
    expect(card).toContain(`- Batches: ${BATCH}.`);
    expect(card).toMatch(new RegExp(`- Rubric versions the items were scored with: .*${rubric!.version}`));
    expect(card).toMatch(/can hold harmful or unsafe text/);
  });
});
