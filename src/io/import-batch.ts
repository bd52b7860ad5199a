import { createHash } from 'node:crypto';
import { createReadStream, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { UserError, errorCode } from '../errors.ts';
import type { Rubric } from '../rubric/load.ts';
import type { ItemScore } from '../rubric/score.ts';
import { scorePool } from '../rubric/score-pool.ts';
import type { Store } from '../store/connect.ts';
import { findBatchByName, findBatchBySource, insertItem } from '../store/repos/batches.ts';
import { recordAudit } from '../store/repos/audit.ts';
import { ensureRubricVersion, storeItemScore } from '../store/repos/scores.ts';
import { nowIso } from '../clock.ts';
import { DEFAULT_MIN_RATIONALE } from '../review/workflow.ts';
import type { BatchItem, LineProblem } from './batch-format.ts';
import { readBatch } from './read-batch.ts';

export interface ImportOptions {
  path: string;
  /** Shown in messages (the file's name as the user gave it). */
  displayName?: string;
  batchName: string;
  rubric: Rubric;
  reviews?: number;
  /** Store the good items and write the bad lines' problems to this JSON Lines file. */
  rejectsPath?: string;
  createdBy?: number | null;
  maxTextBytes?: number;
  /** Characters a rationale needs in this batch (default 20). */
  rationaleMin?: number;
  /** Worker threads to score with (0: the calling thread); the default is `defaultScoreThreads()`. */
  scoreThreads?: number;
  onProgress?: (progress: ImportProgress) => void;
}

/** Where an import is: reading and checking every line, then storing and scoring the items. */
export interface ImportProgress {
  phase: 'checking' | 'storing';
  /** Items checked or stored so far. */
  done: number;
  /** Items in the file (known once checking is over). */
  total: number | null;
}

/** Items scored ahead of the one being stored: keeps every scoring thread busy, memory bounded. */
const SCORING_WINDOW = 64;

export interface ImportResult {
  batchId: number;
  items: number;
  responses: number;
  rejected: number;
}

/** The import refused: every problem found, in file order. Nothing was stored. */
export class ImportRefused extends UserError {
  constructor(readonly problems: LineProblem[], readonly file: string) {
    super(`${file}: ${problems.length} problem(s) — nothing was imported; fix the lines above, or import the good lines with --skip-invalid REJECTS.jsonl`);
  }
}

async function validate(options: ImportOptions): Promise<{ hash: string; problems: LineProblem[]; items: number }> {
  const hash = createHash('sha256');
  const stream = createReadStream(options.path);
  stream.on('data', (chunk) => hash.update(chunk));
  const problems: LineProblem[] = [];
  let items = 0;
  try {
    for await (const event of readBatch(stream, options.path, { maxTextBytes: options.maxTextBytes })) {
      if (event.kind === 'problems') problems.push(...event.problems);
      else if (++items % 500 === 0) options.onProgress?.({ phase: 'checking', done: items, total: null });
    }
  } catch (error) {
    const code = errorCode(error);
    throw new UserError(code === 'ENOENT' ? `${options.displayName ?? options.path}: no such file — check the path` : `${options.displayName ?? options.path}: cannot read (${code ?? String(error)})`);
  }
  return { hash: hash.digest('hex'), problems, items };
}

/**
 * Imports a batch file: every line is checked first; a file with any bad line is refused whole
 * (`ImportRefused`, nothing stored) unless a rejects file is given, in which case the good items
 * are stored and the problems written there. The same file imported twice (same bytes) is
 * refused. Items are stored and scored in one transaction, so a failure part-way stores nothing.
 */
export async function importBatch(store: Store, options: ImportOptions): Promise<ImportResult> {
  const name = options.displayName ?? options.path;
  const { hash, problems, items } = await validate(options);
  if (problems.length && !options.rejectsPath) throw new ImportRefused(problems, name);
  if (!items) throw new UserError(`${name}: no valid items to import${problems.length ? ` (${problems.length} problem(s) written to ${options.rejectsPath})` : ' — the file holds no prompts'}`);
  const earlier = await findBatchBySource(store.db, hash);
  if (earlier) throw new UserError(`${name} was already imported as batch "${earlier.name}" on ${earlier.created_at.slice(0, 10)} — nothing new was stored`);
  if (await findBatchByName(store.db, options.batchName)) throw new UserError(`a batch named "${options.batchName}" already exists — choose another name with --batch`);
  if (options.rejectsPath) writeFileSync(options.rejectsPath, problems.map((p) => JSON.stringify({ line: p.line, field: p.field, reason: p.message })).join('\n') + (problems.length ? '\n' : ''));

  const { rubric } = options;
  options.onProgress?.({ phase: 'storing', done: 0, total: items });
  const pool = scorePool(rubric, items, options.scoreThreads);
  try {
    return await store.db.transaction().execute(async (trx) => {
      await ensureRubricVersion(trx, rubric);
      const createdAt = nowIso();
      const { id: batchId } = await trx
        .insertInto('batches')
        .values({
          name: options.batchName,
          source_hash: hash,
          source_name: name,
          reviews_required: options.reviews ?? rubric.agreement.reviews,
          blind_first: rubric.agreement.blindFirst ? 1 : 0,
          consensus_rule: JSON.stringify({ kind: rubric.agreement.rule, threshold: rubric.agreement.threshold }),
          rubric_id: rubric.id,
          rationale_min: options.rationaleMin ?? DEFAULT_MIN_RATIONALE,
          created_by: options.createdBy ?? null,
          created_at: createdAt,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      let stored = 0;
      let responses = 0;
      // Items are scored ahead (on the pool's threads) and stored in file order.
      const ahead: { item: BatchItem; score: Promise<ItemScore> }[] = [];
      const storeNext = async () => {
        const { item, score } = ahead.shift()!;
        const { itemId, responseRows } = await insertItem(trx, batchId, item, createdAt);
        await storeItemScore(trx, itemId, await score, responseRows);
        stored++;
        responses += item.responses.length;
        if (stored % 100 === 0 || stored === items) options.onProgress?.({ phase: 'storing', done: stored, total: items });
      };
      try {
        for await (const event of readBatch(createReadStream(options.path), options.path, { maxTextBytes: options.maxTextBytes })) {
          if (event.kind !== 'item') continue;
          const { item } = event;
          ahead.push({ item, score: pool.score({ prompt: item.prompt, responses: item.responses, flagSeverity: item.flag?.severity ?? null }) });
          if (ahead.length >= SCORING_WINDOW) await storeNext();
        }
        while (ahead.length) await storeNext();
      } finally {
        // a failure part-way leaves scores in flight: settle them so none is reported unhandled
        for (const { score } of ahead) score.catch(() => {});
      }
      await recordAudit(trx, { actorId: options.createdBy ?? null, kind: 'import', subject: `batch:${batchId}`, detail: { name: options.batchName, items: stored, responses, rejected: problems.length, rubric: `${rubric.id}@${rubric.version}`, source: name } });
      return { batchId, items: stored, responses, rejected: problems.length };
    });
  } finally {
    await pool.close();
  }
}

/**
 * Imports a batch that arrived as bytes (a browser upload or an API body): saved to a private
 * temporary file for the two reading passes, then removed.
 */
export async function importUploaded(store: Store, bytes: Uint8Array, format: 'jsonl' | 'csv', options: Omit<ImportOptions, 'path'>): Promise<ImportResult> {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-upload-'));
  try {
    const path = join(dir, `upload.${format}`);
    writeFileSync(path, bytes);
    return await importBatch(store, { ...options, path });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
