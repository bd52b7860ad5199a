/** @jsxImportSource hono/jsx */
import { Hono, type Context } from 'hono';
import { HttpError } from '../../errors.ts';
import { displayOrder } from '../../review/display-order.ts';
import { rankingProblem } from '../../review/ranking.ts';
import { claimNext, ReviewConflict, ReviewInvalid, submitReview } from '../../review/workflow.ts';
import type { ScoredFinding } from '../../rubric/score.ts';
import { recordAudit } from '../../store/repos/audit.ts';
import type { Ranks } from '../../stats/pairwise-agreement.ts';
import { ReviewPage, type ReviewCandidate } from '../../../views/review-page.tsx';
import { NothingWaitingPage } from '../../../views/nothing-waiting-page.tsx';
import { BreakPage } from '../../../views/break-page.tsx';
import { dailySoftLimit, reviewedToday } from '../../review/exposure.ts';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

type Ctx = Context<AppEnv>;

/** The item, its candidates in this reviewer's display order, and their newest stored scores. */
async function loadForReview(c: Ctx, itemId: number) {
  const { db } = c.get('store');
  const user = c.get('user')!;
  const item = await db.selectFrom('items').innerJoin('batches', 'batches.id', 'items.batch_id').select(['items.id', 'items.prompt_id', 'items.prompt', 'items.flag_reason', 'items.flag_severity', 'batches.blind_first', 'batches.rationale_min']).where('items.id', '=', itemId).executeTakeFirst();
  if (!item) throw new HttpError(404, `There is no item ${itemId}. Take the next one from the queue.`);
  const claim = await db.selectFrom('work_claims').select('expires_at').where('item_id', '=', itemId).where('user_id', '=', user.id).where('expires_at', '>', new Date().toISOString()).executeTakeFirst();
  if (!claim) throw new HttpError(409, 'You do not hold this item (your claim may have expired and returned it to the queue). Take the next item from the queue.');
  const responses = await db.selectFrom('responses').select(['id', 'response_id', 'text']).where('item_id', '=', itemId).orderBy('position').execute();
  const scores = await db.selectFrom('scores').select(['response_id', 'overall', 'band', 'suggested_rank', 'criteria', 'findings', 'id']).where('response_id', 'in', responses.map((r) => r.id)).orderBy('id').execute();
  const latest = new Map(scores.map((s) => [s.response_id, s]));
  const order = displayOrder(responses.map((r) => r.response_id), user.id, itemId);
  const candidates: ReviewCandidate[] = order.map((id, i) => {
    const r = responses.find((x) => x.response_id === id)!;
    const s = latest.get(r.id);
    return { responseId: id, label: String.fromCharCode(65 + i), text: r.text, score: s ? { overall: Number(s.overall), band: s.band, suggestedRank: Number(s.suggested_rank), criteria: JSON.parse(s.criteria), findings: JSON.parse(s.findings) as ScoredFinding[] } : undefined };
  });
  const critical = candidates.some((cand) => cand.score?.findings.some((f) => f.severity === 'critical'));
  const warning = critical ? 'some candidates hold passages a rubric marks as critical (unsafe advice or personal data)' : item.flag_severity === 'high' || item.flag_severity === 'critical' ? `flagged ${item.flag_severity}: ${item.flag_reason ?? ''}` : null;
  return { item, candidates, warning, order, reviewedToday: await reviewedToday(db, user.id) };
}

function ranksFrom(body: Record<string, unknown>, ids: string[]): Ranks {
  return Object.fromEntries(ids.map((id) => [id, Number(body[`rank_${id}`])]));
}

function page(c: Ctx, data: Awaited<ReturnType<typeof loadForReview>>, extra: { revealed: boolean; firstRanking: Ranks | null; startedAt: string; error?: string }, status: 200 | 409 | 422 = 200) {
  return c.html(
    <ReviewPage user={c.get('user')!} csrfToken={c.get('csrfToken')} reviewedToday={data.reviewedToday} dailyLimit={dailySoftLimit()} itemId={data.item.id} promptId={data.item.prompt_id} prompt={data.item.prompt} flag={data.item.flag_reason} candidates={data.candidates} warning={data.warning} minRationale={Number(data.item.rationale_min)} {...extra} />,
    status,
  );
}

/** Reviewing: take the next item, rank it blind, reveal, revise, submit — or skip or escalate. */
export function reviewRoutes() {
  const app = new Hono<AppEnv>();
  const reviewer = requireRole('reviewer');

  app.get('/review/next', reviewer, async (c) => {
    const limit = dailySoftLimit();
    const today = await reviewedToday(c.get('store').db, c.get('user')!.id);
    if (today >= limit && c.req.query('continue') !== '1') return c.html(<BreakPage user={c.get('user')!} csrfToken={c.get('csrfToken')} today={today} limit={limit} />);
    const batch = c.req.query('batch');
    if (batch !== undefined && !/^[0-9]+$/.test(batch)) throw new HttpError(400, `batch must be a batch number, not "${batch}". Pick a batch from the queue's filter.`);
    const next = await claimNext(c.get('store'), c.get('user')!.id, { batchId: batch === undefined ? undefined : Number(batch) });
    if (!next) return c.html(<NothingWaitingPage user={c.get('user')!} csrfToken={c.get('csrfToken')} />);
    return c.redirect(`/review/${next.itemId}`, 303);
  });

  app.get('/review/:id{[0-9]+}', reviewer, async (c) => {
    const data = await loadForReview(c, Number(c.req.param('id')));
    return page(c, data, { revealed: !data.item.blind_first, firstRanking: null, startedAt: new Date().toISOString() });
  });

  app.post('/review/:id{[0-9]+}/reveal', reviewer, async (c) => {
    const data = await loadForReview(c, Number(c.req.param('id')));
    const body = await c.req.parseBody();
    const first = ranksFrom(body, data.order);
    const startedAt = typeof body.started_at === 'string' ? body.started_at : new Date().toISOString();
    const problem = rankingProblem(first, data.order);
    if (problem) return page(c, data, { revealed: false, firstRanking: null, startedAt, error: `Not revealed: ${problem}.` }, 422);
    await recordAudit(c.get('store').db, { actorId: c.get('user')!.id, kind: 'reveal', subject: `item:${data.item.id}` });
    return page(c, data, { revealed: true, firstRanking: first, startedAt });
  });

  app.post('/review/:id{[0-9]+}/submit', reviewer, async (c) => {
    const data = await loadForReview(c, Number(c.req.param('id')));
    const body = await c.req.parseBody();
    const startedAt = typeof body.started_at === 'string' ? body.started_at : new Date().toISOString();
    let first: Ranks | null = null;
    try {
      first = typeof body.first === 'string' ? (JSON.parse(body.first) as Ranks) : null;
    } catch {
      first = null;
    }
    const final = ranksFrom(body, data.order);
    try {
      await submitReview(c.get('store'), {
        itemId: data.item.id,
        reviewerId: c.get('user')!.id,
        status: 'submitted',
        displayOrder: data.order,
        firstRanking: first,
        finalRanking: final,
        rationale: typeof body.rationale === 'string' ? body.rationale : '',
        startedAt,
        revealedAt: first ? new Date().toISOString() : null,
        timeSpentMs: Math.max(0, Date.now() - Date.parse(startedAt) || 0),
      });
    } catch (error) {
      if (error instanceof ReviewInvalid) return page(c, data, { revealed: true, firstRanking: first, startedAt, error: `Not submitted: ${error.message}.` }, 422);
      if (error instanceof ReviewConflict) throw new HttpError(409, `Not submitted: ${error.message}.`);
      throw error;
    }
    return c.redirect('/review/next', 303);
  });

  app.post('/review/:id{[0-9]+}/skip', reviewer, async (c) => {
    const data = await loadForReview(c, Number(c.req.param('id')));
    const body = await c.req.parseBody();
    const status = body.action === 'escalate' ? 'escalated' : 'skipped';
    const startedAt = typeof body.started_at === 'string' ? body.started_at : new Date().toISOString();
    try {
      await submitReview(c.get('store'), { itemId: data.item.id, reviewerId: c.get('user')!.id, status, displayOrder: data.order, reason: typeof body.reason === 'string' ? body.reason : '', startedAt, timeSpentMs: Math.max(0, Date.now() - Date.parse(startedAt) || 0) });
    } catch (error) {
      if (error instanceof ReviewInvalid) return page(c, data, { revealed: false, firstRanking: null, startedAt, error: `Not ${status}: ${error.message}.` }, 422);
      if (error instanceof ReviewConflict) throw new HttpError(409, error.message);
      throw error;
    }
    return c.redirect('/review/next', 303);
  });

  app.post('/review/:id{[0-9]+}/unmask', reviewer, async (c) => {
    await recordAudit(c.get('store').db, { actorId: c.get('user')!.id, kind: 'unmask', subject: `item:${c.req.param('id')}` });
    return c.body(null, 204);
  });

  return app;
}
