import { createHash } from 'node:crypto';
import type { Kysely } from 'kysely';
import { generatePassword } from '../auth/password.ts';
import type { Role } from '../auth/roles.ts';
import { fileURLToPath } from 'node:url';
import { loadRubricFile } from '../rubric/load.ts';
import { scoreItem } from '../rubric/score.ts';
import { ensureRubricVersion, storeItemScore } from '../store/repos/scores.ts';
import { storeBatch } from '../store/repos/batches.ts';
import { recordAudit } from '../store/repos/audit.ts';
import { insertDecision, insertReview, setItemState, type Ranking } from '../store/repos/reviews.ts';
import { getSetting, setSettingOnce } from '../store/repos/settings.ts';
import { createUser } from '../store/repos/users.ts';
import type { Database } from '../store/schema.ts';
import { cairnfieldItems } from './cairnfield-items.ts';
import { demoReviews } from './demo-reviews.ts';

/** One demo account per role; the second reviewer makes agreement and adjudication possible. */
export const DEMO_USERS: { username: string; displayName: string; roles: Role[] }[] = [
  { username: 'reviewer', displayName: 'Ines Calloway (demo reviewer)', roles: ['reviewer'] },
  { username: 'reviewer2', displayName: 'Tobin Reyes (demo reviewer)', roles: ['reviewer'] },
  { username: 'adjudicator', displayName: 'Maren Voss (demo adjudicator)', roles: ['adjudicator', 'reviewer'] },
  { username: 'policy', displayName: 'Odile Brannock (demo policy owner)', roles: ['policy'] },
  { username: 'data', displayName: 'Kit Aldana (demo data engineer)', roles: ['data'] },
  { username: 'admin', displayName: 'Pell Harrowgate (demo admin)', roles: ['admin'] },
];

export const DEMO_BATCH_NAME = 'Cairnfield support — flagged week 48';
/** The rubric the demo batch is scored with. */
export const DEMO_RUBRIC = fileURLToPath(new URL('../../rubrics/cairnfield-support.yaml', import.meta.url));
const SEEDED_KEY = 'demo_seeded_at';

export interface SeedResult {
  /** False when the database was already seeded (or already had users): nothing was written. */
  seeded: boolean;
  logins: { username: string; password: string; roles: Role[] }[];
}

/**
 * Seeds the demo scenario into an empty database: users, one batch of 40 items, and reviews
 * and decisions on the first items. Runs once: a database that was seeded before, or that has
 * users of its own, is left alone. Passwords are random unless given (tests pass fixed ones),
 * and are returned so the caller can print them this one time.
 */
export async function seedDemo(db: Kysely<Database>, options: { password?: (username: string) => string } = {}): Promise<SeedResult> {
  if (await getSetting(db, SEEDED_KEY)) return { seeded: false, logins: [] };
  const anyUser = await db.selectFrom('users').select('id').limit(1).executeTakeFirst();
  if (anyUser) return { seeded: false, logins: [] };
  if (!(await setSettingOnce(db, SEEDED_KEY, new Date().toISOString()))) return { seeded: false, logins: [] };

  const logins = DEMO_USERS.map((u) => ({ username: u.username, roles: u.roles, password: options.password?.(u.username) ?? generatePassword() }));
  const ids = new Map<string, number>();
  for (const [i, user] of DEMO_USERS.entries()) {
    ids.set(user.username, await createUser(db, { ...user, password: logins[i].password }));
  }

  const items = cairnfieldItems.map((item) => ({
    promptId: item.promptId,
    prompt: item.prompt,
    flag: item.flag ?? null,
    responses: item.responses.map((text, i) => ({ responseId: String.fromCharCode(97 + i), text })),
  }));
  const rubric = loadRubricFile(DEMO_RUBRIC).rubric;
  if (!rubric) throw new Error(`the demo rubric ${DEMO_RUBRIC} does not load — run plumbline rubric check on it`);
  const { itemIds } = await storeBatch(db, {
    name: DEMO_BATCH_NAME,
    sourceHash: createHash('sha256').update(JSON.stringify(items)).digest('hex'),
    sourceName: 'demo: cairnfield-items',
    reviewsRequired: 2,
    blindFirst: true,
    consensusRule: { kind: 'top' },
    rubricId: rubric.id,
    createdBy: ids.get('data') ?? null,
    items,
  });
  await ensureRubricVersion(db, rubric, ids.get('policy') ?? null, 'shipped with the demo');
  for (const [i, item] of items.entries()) {
    const rows = await db.selectFrom('responses').select(['id', 'response_id']).where('item_id', '=', itemIds[i]).execute();
    const scored = scoreItem(rubric, { prompt: item.prompt, responses: item.responses, flagSeverity: item.flag?.severity ?? null });
    await storeItemScore(db, itemIds[i], scored, new Map(rows.map((r) => [r.response_id, r.id])));
  }

  const byPrompt = new Map(cairnfieldItems.map((item, i) => [item.promptId, { itemId: itemIds[i], count: item.responses.length }]));
  for (const plan of demoReviews) {
    const target = byPrompt.get(plan.promptId);
    if (!target) continue;
    const order = Array.from({ length: target.count }, (_, i) => String.fromCharCode(97 + i));
    for (const review of plan.reviews) {
      await insertReview(db, {
        itemId: target.itemId,
        reviewerId: ids.get(review.by)!,
        status: 'submitted',
        displayOrder: rotate(order, review.by.length),
        firstRanking: review.first ?? review.ranking,
        finalRanking: review.ranking,
        rationale: review.rationale,
        startedAt: '2026-11-23T09:00:00.000Z',
        revealedAt: '2026-11-23T09:03:00.000Z',
        submittedAt: '2026-11-23T09:05:00.000Z',
        timeSpentMs: 240_000 + review.rationale.length * 200,
      });
      await recordAudit(db, { actorId: ids.get(review.by)!, kind: 'review', subject: `item:${target.itemId}` });
    }
    if (plan.decision) {
      await insertDecision(db, {
        itemId: target.itemId,
        adjudicatorId: plan.decision.method === 'adjudication' ? ids.get('adjudicator')! : null,
        method: plan.decision.method,
        ranking: plan.decision.ranking,
        rationale: plan.decision.rationale,
      });
    } else {
      await setItemState(db, target.itemId, plan.reviews.length >= 2 ? 'adjudication' : 'in_review');
    }
  }
  return { seeded: true, logins };
}

function rotate(order: string[], by: number): string[] {
  const k = by % order.length;
  return [...order.slice(k), ...order.slice(0, k)];
}

export type { Ranking };
