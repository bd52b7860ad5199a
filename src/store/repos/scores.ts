import { delimited } from '../delimited-list.ts';
import type { Kysely, Transaction } from 'kysely';
import { nowIso } from '../../clock.ts';
import type { Rubric } from '../../rubric/load.ts';
import type { ItemScore } from '../../rubric/score.ts';
import type { Database } from '../schema.ts';

type Db = Kysely<Database> | Transaction<Database>;

/** Stores a rubric version once (same id and content hash, same row). */
export async function ensureRubricVersion(db: Db, rubric: Rubric, authorId: number | null = null, note: string | null = null): Promise<void> {
  await db
    .insertInto('rubric_versions')
    .values({ rubric_id: rubric.id, version: rubric.version, content: rubric.source, author_id: authorId, note, created_at: nowIso() })
    .onConflict((oc) => oc.columns(['rubric_id', 'version']).doNothing())
    .execute();
}

/**
 * Stores an item's scores (one row per response, recording the rubric version) and its
 * priority. `responseRowIds` maps each imported response id to its stored row id.
 */
export async function storeItemScore(db: Db, itemId: number, scored: ItemScore, responseRowIds: Map<string, number>): Promise<void> {
  const createdAt = nowIso();
  await db
    .insertInto('scores')
    .values(
      scored.responses.map((r) => ({
        response_id: responseRowIds.get(r.responseId)!,
        rubric_id: scored.rubric.id,
        rubric_version: scored.rubric.version,
        overall: r.score,
        band: r.band,
        suggested_rank: r.suggestedRank,
        criteria: JSON.stringify(r.criteria),
        findings: JSON.stringify(r.findings),
        created_at: createdAt,
      })),
    )
    .onConflict((oc) => oc.columns(['response_id', 'rubric_version']).doNothing())
    .execute();
  await db
    .updateTable('items')
    .set({
      priority: scored.priority.value,
      score_bands: delimited(scored.responses.map((r) => r.band)),
      finding_checks: delimited(scored.responses.flatMap((r) => r.findings.map((f) => f.check))),
    })
    .where('id', '=', itemId)
    .execute();
}
