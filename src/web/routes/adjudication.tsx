/** @jsxImportSource hono/jsx */
import { Hono, type Context } from 'hono';
import { HttpError } from '../../errors.ts';
import { adjudicate, ReviewConflict, ReviewInvalid } from '../../review/workflow.ts';
import type { ScoredFinding } from '../../rubric/score.ts';
import { AdjudicationPage, AdjudicationQueuePage, type ReviewColumn } from '../../../views/adjudication-pages.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

async function pageData(c: Context<AppEnv>, itemId: number) {
  const { db } = c.get('store');
  const item = await db.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.id', 'items.prompt_id', 'items.prompt', 'items.state', 'batches.rationale_min']).where('items.id', '=', itemId).executeTakeFirst();
  if (!item) throw new HttpError(404, `There is no item ${itemId}.`);
  const responses = await db.selectFrom('responses').select(['id', 'response_id', 'text']).where('item_id', '=', itemId).orderBy('position').execute();
  const scores = await db.selectFrom('scores').select(['response_id', 'overall', 'band', 'suggested_rank', 'findings', 'id']).where('response_id', 'in', responses.map((r) => r.id)).orderBy('id').execute();
  const latest = new Map(scores.map((s) => [s.response_id, s]));
  const reviews = await db.selectFrom('reviews').innerJoin('users', 'users.id', 'reviews.reviewer_id').select(['users.display_name', 'reviews.status', 'reviews.final_ranking', 'reviews.rationale', 'reviews.reason']).where('reviews.item_id', '=', itemId).where('reviews.status', '!=', 'skipped').orderBy('reviews.id').execute();
  return {
    item,
    candidates: responses.map((r) => {
      const s = latest.get(r.id);
      return { responseId: r.response_id, text: r.text, score: s ? Number(s.overall) : null, band: s?.band ?? null, suggested: s ? Number(s.suggested_rank) : null, findings: s ? (JSON.parse(s.findings) as ScoredFinding[]).map((f) => `${f.criterion} (${f.severity}): ${f.message}`) : [] };
    }),
    reviews: reviews.map((r): ReviewColumn => ({ reviewer: r.display_name, status: r.status, ranking: r.final_ranking ? JSON.parse(r.final_ranking) : null, rationale: r.rationale, reason: r.reason })),
  };
}

/** Adjudication: items whose reviewers disagreed or that were escalated, and the final decision. */
export function adjudicationRoutes() {
  const app = new Hono<AppEnv>();
  const adjudicator = requireRole('adjudicator');

  app.get('/adjudicate', adjudicator, async (c) => {
    const rows = await c
      .get('store')
      .db.selectFrom('items')
      .innerJoin('batches', 'batches.id', 'items.batch_id')
      .select((eb) => ['items.id', 'items.prompt_id', 'items.prompt', 'items.state', 'batches.name as batch', eb.selectFrom('reviews').whereRef('reviews.item_id', '=', 'items.id').where('reviews.status', '=', 'submitted').select((e) => e.fn.countAll<number>().as('n')).as('reviews')])
      .where('items.state', 'in', ['adjudication', 'escalated'])
      .orderBy('items.priority', 'desc')
      .orderBy('items.id')
      .execute();
    return c.html(<AdjudicationQueuePage user={c.get('user')!} csrfToken={c.get('csrfToken')} rows={rows.map((r) => ({ ...r, reviews: Number(r.reviews ?? 0) }))} />);
  });

  app.get('/adjudicate/:id{[0-9]+}', adjudicator, async (c) => {
    const data = await pageData(c, Number(c.req.param('id')));
    if (data.item.state !== 'adjudication' && data.item.state !== 'escalated') throw new HttpError(409, `This item does not need a decision (it is ${data.item.state.replace('_', ' ')}).`);
    return c.html(<AdjudicationPage user={c.get('user')!} csrfToken={c.get('csrfToken')} itemId={data.item.id} promptId={data.item.prompt_id} prompt={data.item.prompt} candidates={data.candidates} reviews={data.reviews} minRationale={Number(data.item.rationale_min)} />);
  });

  app.post('/adjudicate/:id{[0-9]+}', adjudicator, async (c) => {
    const itemId = Number(c.req.param('id'));
    const body = await c.req.parseBody();
    const data = await pageData(c, itemId);
    const ranking = Object.fromEntries(data.candidates.map((cand) => [cand.responseId, Number(body[`rank_${cand.responseId}`])]));
    try {
      await adjudicate(c.get('store'), { itemId, adjudicatorId: c.get('user')!.id, ranking, rationale: typeof body.rationale === 'string' ? body.rationale : '' });
    } catch (error) {
      if (error instanceof ReviewInvalid) return c.html(<AdjudicationPage user={c.get('user')!} csrfToken={c.get('csrfToken')} itemId={itemId} promptId={data.item.prompt_id} prompt={data.item.prompt} candidates={data.candidates} reviews={data.reviews} minRationale={Number(data.item.rationale_min)} error={`Not recorded: ${error.message}.`} />, 422);
      if (error instanceof ReviewConflict) throw new HttpError(409, `Not recorded: ${error.message}.`);
      throw error;
    }
    return c.redirect('/adjudicate', 303);
  });

  return app;
}
