import { createWriteStream, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { once } from 'node:events';
import { fileURLToPath } from 'node:url';
import { loadRubric } from '../../src/rubric/load.ts';
import { scoreItem } from '../../src/rubric/score.ts';
import { openStore } from '../../src/store/connect.ts';
import { createUser } from '../../src/store/repos/users.ts';
import { insertDecision } from '../../src/store/repos/reviews.ts';
import { prng, syntheticResponse } from './corpus.ts';
import { BIN, loadTest, runMeasured, startServerProcess } from './processes.ts';
import type { BenchRow } from './report.ts';

const RUN_TS = fileURLToPath(new URL('./run-ts.mjs', import.meta.url));
const BARE_SERVER = fileURLToPath(new URL('./bare-table-server.tsx', import.meta.url));
const RUBRIC = fileURLToPath(new URL('../../rubrics/general.yaml', import.meta.url));
const RESPONSES_PER_PROMPT = 5;
const PASSWORD = 'bench-password-1';

/** A batch file of `prompts` prompts with five generated responses each (about 800 characters). */
async function writeBatch(path: string, prompts: number): Promise<void> {
  const random = prng(2024);
  const out = createWriteStream(path);
  for (let i = 0; i < prompts; i++) {
    const responses = Array.from({ length: RESPONSES_PER_PROMPT }, (_, k) => ({ response_id: `r${k + 1}`, text: syntheticResponse(random, 400 + Math.round(random() * 800)) }));
    const line = JSON.stringify({ prompt_id: `bench-${i}`, prompt: `Question ${i}: how should I store fuel and boil water on a rainy trip?`, responses });
    if (!out.write(`${line}\n`)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

/** Single-thread score-only throughput (what `plumbline score` does per item), responses per second. */
function scoreOnly(path: string, prompts: number): number {
  const rubric = loadRubric(readFileSync(RUBRIC, 'utf8')).rubric!;
  const lines = readFileSync(path, 'utf8').split('\n', prompts);
  const items = lines.map((l) => JSON.parse(l) as { prompt: string; responses: { response_id: string; text: string }[] }).map((x) => ({ prompt: x.prompt, responses: x.responses.map((r) => ({ responseId: r.response_id, text: r.text })), flagSeverity: null }));
  for (const item of items.slice(0, 50)) scoreItem(rubric, item); // warm up
  const t0 = performance.now();
  for (const item of items) scoreItem(rubric, item);
  return (items.length * RESPONSES_PER_PROMPT) / ((performance.now() - t0) / 1000);
}

/** Decisions dated before this are left out of the tenth-size export (`--since`). */
const TENTH_SINCE = '2026-06-01';

/**
 * Marks the first `items` items of the batch decided by adjudication (ranks 1–5), for the export
 * benchmark; all but the last tenth of the decisions are dated before TENTH_SINCE, so that
 * `--since TENTH_SINCE` exports a tenth of the pairs.
 */
async function decide(dbFile: string, items: number): Promise<void> {
  const store = await openStore({ kind: 'sqlite', file: dbFile });
  try {
    const ids = await store.db.selectFrom('items').select('id').orderBy('id').limit(items).execute();
    await store.db.transaction().execute(async (trx) => {
      for (const { id } of ids) await insertDecision(trx, { itemId: id, adjudicatorId: null, method: 'adjudication', ranking: { r1: 1, r2: 2, r3: 3, r4: 4, r5: 5 }, rationale: 'Decided for the export benchmark.', rubricVersion: null });
      const older = ids.slice(0, items - Math.round(items / 10)).map((r) => r.id);
      if (older.length) await trx.updateTable('adjudications').set({ created_at: '2026-01-01T00:00:00.000Z' }).where('item_id', '<=', older[older.length - 1]).execute();
    });
    await createUser(store.db, { username: 'bench', displayName: 'Benchmark reviewer', password: PASSWORD, roles: ['reviewer'] });
  } finally {
    await store.close();
  }
}

async function signIn(base: string): Promise<string> {
  const page = await fetch(`${base}/login`);
  const cookie = page.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const csrf = (await page.text()).match(/name="csrf-token" content="([^"]+)"/)![1];
  const res = await fetch(`${base}/login`, { method: 'POST', redirect: 'manual', headers: { cookie, origin: base, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ username: 'bench', password: PASSWORD, _csrf: csrf, next: '/' }) });
  if (res.status !== 303) throw new Error(`bench sign-in failed: ${res.status}`);
  return [cookie, ...res.headers.getSetCookie().map((c) => c.split(';')[0])].join('; ');
}

/**
 * Issue 5's figures: importing 20,000 prompts × 5 responses with scoring against score-only
 * throughput, with the import's peak memory; exporting 100,000 pairs (speed, and peak memory
 * against an export a tenth the size, and of none); the queue page with the batch stored against a bare
 * Hono route rendering a 50-row table, 50 connections each.
 */
export async function workflowBench(options: { quick: boolean }): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const prompts = options.quick ? 2000 : 20_000;
  const responses = prompts * RESPONSES_PER_PROMPT;
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
  try {
    const batch = join(dir, 'batch.jsonl');
    const dbFile = join(dir, 'bench.db');
    await writeBatch(batch, prompts);
    const env = { PLUMBLINE_DB: dbFile };

    // import with scoring (worker threads) vs score-only on one thread
    const scoreRate = scoreOnly(batch, Math.min(prompts, 1000));
    const imported = await runMeasured([BIN, 'import', batch, '--batch', 'bench', '--rubric', RUBRIC], env);
    if (imported.code !== 0) throw new Error(`bench import failed:\n${imported.output}`);
    const importRate = responses / (imported.ms / 1000);
    rows.push({ area: 'workflow', name: 'score only (one thread, in process)', value: scoreRate, unit: 'responses/s' });
    rows.push({ area: 'workflow', name: `import ${responses.toLocaleString('en')} responses with scoring into SQLite (whole command)`, value: importRate, unit: 'responses/s', ratio: importRate / scoreRate, target: '≥ 0.6× score only', pass: importRate / scoreRate >= 0.6 });
    rows.push({ area: 'workflow', name: 'import: peak resident memory (process and scoring threads)', value: imported.peakRssMb, unit: 'MB', target: '≤ 400 MB', pass: imported.peakRssMb <= 400 });

    // export: 100,000 pairs (10 per decided item), against a tenth of that and against none:
    // flat memory means the whole export needs no more than the tenth
    const pairs = options.quick ? 10_000 : 100_000;
    await decide(dbFile, pairs / 10);
    const exportTo = (file: string, extra: string[]) => runMeasured([BIN, 'export', '--format', 'pairs', '--batch', 'bench', '--out', join(dir, file), ...extra], env);
    const none = await exportTo('none.jsonl', ['--since', '2100-01-01']);
    const tenth = await exportTo('tenth.jsonl', ['--since', TENTH_SINCE]);
    const whole = await exportTo('pairs.jsonl', []);
    if (whole.code !== 0 || tenth.code !== 0) throw new Error(`bench export failed:\n${whole.output}${tenth.output}`);
    const mb = statSync(join(dir, 'pairs.jsonl')).size / 1024 / 1024;
    const lineCount = (file: string) => readFileSync(join(dir, file), 'utf8').split('\n').length - 1;
    const lines = lineCount('pairs.jsonl');
    const tenthLines = lineCount('tenth.jsonl');
    rows.push({ area: 'workflow', name: `export ${lines.toLocaleString('en')} pairs (${mb.toFixed(0)} MB JSON Lines, whole command)`, value: mb / (whole.ms / 1000), unit: 'MB/s', target: '≥ 20 MB/s', pass: mb / (whole.ms / 1000) >= 20 });
    rows.push({
      area: 'workflow',
      name: `export: peak memory, ${lines.toLocaleString('en')} pairs vs ${tenthLines.toLocaleString('en')} (flat: the same)`,
      value: whole.peakRssMb - tenth.peakRssMb,
      unit: 'MB more',
      target: 'flat (< 20 MB more)',
      pass: whole.peakRssMb - tenth.peakRssMb < 20,
      detail: `${whole.peakRssMb.toFixed(0)} MB vs ${tenth.peakRssMb.toFixed(0)} MB; an export of no pairs: ${none.peakRssMb.toFixed(0)} MB`,
    });

    // queue page vs a bare Hono table, 50 connections each, one after the other
    const durationMs = options.quick ? 3000 : 10_000;
    const bare = await startServerProcess([RUN_TS, BARE_SERVER], {}, /serving (http:\/\/\S+?)\/?$/m);
    const reference = await loadTest(bare.url, { connections: 50, durationMs });
    await bare.stop();
    const app = await startServerProcess([BIN, 'serve', '--no-demo'], { ...env, PORT: '0' }, /serving (http:\/\/\S+?)\/? /);
    const cookie = await signIn(app.url);
    const queue = await loadTest(`${app.url}/`, { connections: 50, durationMs, headers: { cookie } });
    // the latency target, at the load the throughput target names: a quarter of the bare route's rate
    const paced = await loadTest(`${app.url}/`, { connections: 50, durationMs, headers: { cookie }, rate: reference.rps / 4 });
    await app.stop();
    rows.push({ area: 'workflow', name: 'bare Hono route, 50-row table, 50 connections', value: reference.rps, unit: 'requests/s', detail: `p50 ${reference.p50.toFixed(1)} ms, p99 ${reference.p99.toFixed(1)} ms, ${reference.errors} errors` });
    rows.push({ area: 'workflow', name: `queue page, ${responses.toLocaleString('en')} responses stored, 50 connections back to back`, value: queue.rps, unit: 'requests/s', ratio: queue.rps / reference.rps, target: '≥ 0.25× bare route', pass: queue.rps / reference.rps >= 0.25 && queue.errors === 0, detail: `p50 ${queue.p50.toFixed(1)} ms, p99 ${queue.p99.toFixed(1)} ms (saturated: 50 requests always waiting), ${queue.errors} errors` });
    rows.push({ area: 'workflow', name: `queue page p99 latency, 50 connections sending a quarter of the bare route's rate (${Math.round(reference.rps / 4)}/s; served ${Math.round(paced.rps)}/s)`, value: paced.p99, unit: 'ms', target: '≤ 50 ms', pass: paced.p99 <= 50 && paced.errors === 0, detail: `p50 ${paced.p50.toFixed(1)} ms, ${paced.errors} errors; latency counted from when each request was due` });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return rows;
}
