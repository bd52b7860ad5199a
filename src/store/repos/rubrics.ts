import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Kysely } from 'kysely';
import { HttpError } from '../../errors.ts';
import { loadRubric, type Rubric } from '../../rubric/load.ts';
import type { Database } from '../schema.ts';
import { recordAudit } from './audit.ts';
import { ensureRubricVersion } from './scores.ts';

export const SHIPPED_RUBRICS_DIR = fileURLToPath(new URL('../../../rubrics/', import.meta.url));

/** The rubrics shipped in rubrics/, loaded (files with problems are left out). */
export function shippedRubrics(dir = SHIPPED_RUBRICS_DIR): Rubric[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith('.yaml'))
    .sort()
    .flatMap((f) => loadRubric(readFileSync(`${dir}${f}`, 'utf8')).rubric ?? []);
}

export interface RubricVersionRow {
  id: number;
  rubric_id: string;
  version: string;
  author: string | null;
  note: string | null;
  created_at: string;
}

/** Published versions of a rubric, newest first. */
export function listVersions(db: Kysely<Database>, rubricId: string): Promise<RubricVersionRow[]> {
  return db
    .selectFrom('rubric_versions')
    .leftJoin('users', 'users.id', 'rubric_versions.author_id')
    .select(['rubric_versions.id', 'rubric_versions.rubric_id', 'rubric_versions.version', 'users.display_name as author', 'rubric_versions.note', 'rubric_versions.created_at'])
    .where('rubric_versions.rubric_id', '=', rubricId)
    .orderBy('rubric_versions.id', 'desc')
    .execute();
}

/** One stored version's text, or undefined. */
export async function versionContent(db: Kysely<Database>, rubricId: string, version: string): Promise<string | undefined> {
  const row = await db.selectFrom('rubric_versions').select('content').where('rubric_id', '=', rubricId).where('version', '=', version).executeTakeFirst();
  return row?.content;
}

/** The rubric in force: its newest published version, or the shipped file when none is published. */
export async function currentRubric(db: Kysely<Database>, rubricId: string): Promise<Rubric | undefined> {
  const latest = await db.selectFrom('rubric_versions').select('content').where('rubric_id', '=', rubricId).orderBy('id', 'desc').limit(1).executeTakeFirst();
  if (latest) return loadRubric(latest.content).rubric;
  return shippedRubrics().find((r) => r.id === rubricId);
}

export interface RubricSummary {
  id: string;
  title: string;
  version: string;
  published: number;
  criteria: number;
}

/** Every rubric known: published ones and shipped files. */
export async function listRubrics(db: Kysely<Database>): Promise<RubricSummary[]> {
  const ids = await db.selectFrom('rubric_versions').select((eb) => ['rubric_id', eb.fn.countAll<number>().as('n')]).groupBy('rubric_id').execute();
  const counts = new Map(ids.map((r) => [r.rubric_id, Number(r.n)]));
  const all = new Set([...counts.keys(), ...shippedRubrics().map((r) => r.id)]);
  const out: RubricSummary[] = [];
  for (const id of [...all].sort()) {
    const rubric = await currentRubric(db, id);
    if (rubric) out.push({ id, title: rubric.title, version: rubric.version, published: counts.get(id) ?? 0, criteria: rubric.criteria.length });
  }
  return out;
}

/**
 * Publishes a draft as a new version of `rubricId`. The draft must load without problems and
 * keep the rubric's id; content already published is refused. Recorded in the audit log.
 */
export async function publishRubric(db: Kysely<Database>, rubricId: string, draft: Rubric, authorId: number, note: string | null): Promise<void> {
  if (draft.id !== rubricId) throw new HttpError(422, `The draft's id is "${draft.id}" but you are editing "${rubricId}". Keep the id, or start a new rubric file.`);
  const existing = await db.selectFrom('rubric_versions').select(['version', 'created_at']).where('rubric_id', '=', rubricId).where('version', '=', draft.version).executeTakeFirst();
  if (existing) throw new HttpError(409, `This content is already published as version ${draft.version} (${existing.created_at.slice(0, 16).replace('T', ' ')}). Change something before publishing.`);
  await db.transaction().execute(async (trx) => {
    await ensureRubricVersion(trx, draft, authorId, note);
    await recordAudit(trx, { actorId: authorId, kind: 'rubric_publish', subject: `rubric:${rubricId}`, detail: { version: draft.version, note } });
  });
}
