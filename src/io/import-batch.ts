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
import { importOwner, sweepUnfinishedImports } from '../store/repos/unfinished-imports.ts';
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
/** Items stored per transaction: large enough to be quick, small enough that reviewers' work never waits long. */
const CHUNK_ITEMS = 200;

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
 * refused. Items are stored in chunks as `staged` and shown together at the end; a failure
 * part-way removes the batch, so a batch is either stored whole or not at all.
 */
export async function importBatch(store: Store, options: ImportOptions): Promise<ImportResult> {
  const name = options.displayName ?? options.path;
  const { hash, problems, items } = await validate(options);
  if (problems.length && !options.rejectsPath) throw new ImportRefused(problems, name);
  if (!items) throw new UserError(`${name}: no valid items to import${problems.length ? ` (${problems.length} problem(s) written to ${options.rejectsPath})` : ' — the file holds no prompts'}`);
  await sweepUnfinishedImports(store.db);
  const earlier = await findBatchBySource(store.db, hash);
  if (earlier?.import_owner) throw new UserError(`${name} is being imported right now as batch "${earlier.name}" (started ${earlier.created_at.slice(0, 16).replace('T', ' ')} UTC) — wait for it to finish`);
  if (earlier) throw new UserError(`${name} was already imported as batch "${earlier.name}" on ${earlier.created_at.slice(0, 10)} — nothing new was stored`);
  if (await findBatchByName(store.db, options.batchName)) throw new UserError(`a batch named "${options.batchName}" already exists — choose another name with --batch`);
  if (options.rejectsPath) writeFileSync(options.rejectsPath, problems.map((p) => JSON.stringify({ line: p.line, field: p.field, reason: p.message })).join('\n') + (problems.length ? '\n' : ''));

  const { rubric } = options;
  options.onProgress?.({ phase: 'storing', done: 0, total: items });
  const owner = importOwner();
  const createdAt = nowIso();
  const batchId = await store.db.transaction().execute(async (trx) => {
    const { id } = await trx
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
        import_owner: owner,
        import_heartbeat_at: createdAt,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return id;
  });
  const pool = scorePool(rubric, items, options.scoreThreads);
  // Items are scored ahead (on the pool's threads) and stored in file order, a chunk per
  // transaction, as `staged`: other work goes on between chunks, and nobody sees the batch
  // until the last step shows it whole. If anything fails the batch is removed; if the process
  // dies, sweepUnfinishedImports removes it.
  const ahead: { item: BatchItem; score: Promise<ItemScore> }[] = [];
  let chunk: { item: BatchItem; score: ItemScore }[] = [];
  let stored = 0;
  let responses = 0;
  const storeChunk = async () => {
    if (!chunk.length) return;
    const batch = chunk;
    chunk = [];
    await store.db.transaction().execute(async (trx) => {
      for (const { item, score } of batch) {
        const { itemId, responseRows } = await insertItem(trx, batchId, item, createdAt, 'staged');
        await storeItemScore(trx, itemId, score, responseRows);
      }
      await trx.updateTable('batches').set({ import_heartbeat_at: nowIso() }).where('id', '=', batchId).execute();
    });
    stored += batch.length;
    responses += batch.reduce((n, x) => n + x.item.responses.length, 0);
    options.onProgress?.({ phase: 'storing', done: stored, total: items });
  };
  const takeScored = async () => {
    const { item, score } = ahead.shift()!;
    chunk.push({ item, score: await score });
    if (chunk.length >= CHUNK_ITEMS) await storeChunk();
  };
  try {
    for await (const event of readBatch(createReadStream(options.path), options.path, { maxTextBytes: options.maxTextBytes })) {
      if (event.kind !== 'item') continue;
      const { item } = event;
      ahead.push({ item, score: pool.score({ prompt: item.prompt, responses: item.responses, flagSeverity: item.flag?.severity ?? null }) });
      if (ahead.length >= SCORING_WINDOW) await takeScored();
    }
    while (ahead.length) await takeScored();
    await storeChunk();
    await store.db.transaction().execute(async (trx) => {
      await ensureRubricVersion(trx, rubric);
      await trx.updateTable('items').set({ state: 'open' }).where('batch_id', '=', batchId).where('state', '=', 'staged').execute();
      await trx.updateTable('batches').set({ import_owner: null, import_heartbeat_at: null }).where('id', '=', batchId).execute();
      await recordAudit(trx, { actorId: options.createdBy ?? null, kind: 'import', subject: `batch:${batchId}`, detail: { name: options.batchName, items: stored, responses, rejected: problems.length, rubric: `${rubric.id}@${rubric.version}`, source: name } });
    });
    return { batchId, items: stored, responses, rejected: problems.length };
  } catch (error) {
    // scores still in flight are settled so that none is reported unhandled
    for (const { score } of ahead) score.catch(() => {});
    await store.db.deleteFrom('batches').where('id', '=', batchId).execute().catch(() => {}); // if this fails too, the sweep removes it
    throw error;
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
