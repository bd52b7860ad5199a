import { mkdtempSync, rmSync, writeFileSync, createReadStream } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readBatch } from '../../src/io/read-batch.ts';
import { compareRubrics, loadBatchItems } from '../../src/rubric/impact.ts';
import { loadRubric, loadRubricFile } from '../../src/rubric/load.ts';
import { scoreItem } from '../../src/rubric/score.ts';
import { openStore } from '../../src/store/connect.ts';
import { migrate } from '../../src/store/migrate.ts';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { ensureRubricVersion, storeItemScore } from '../../src/store/repos/scores.ts';
import { prng, syntheticResponse } from './corpus.ts';
import type { BenchRow } from './report.ts';

/** Issue 4's figure: re-scoring stored responses for a preview against scoring them from a file. */
export async function rubricBench(options: { quick: boolean }): Promise<BenchRow[]> {
  const prompts = options.quick ? 400 : 2000;
  const random = prng(5);
  const items = Array.from({ length: prompts }, (_, i) => ({
    promptId: `p${i}`,
    prompt: 'How long should I boil stream water to make it safe to drink?',
    responses: Array.from({ length: 5 }, (_, k) => ({ responseId: String.fromCharCode(97 + k), text: syntheticResponse(random, 600) })),
  }));
  const responses = prompts * 5;
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
  try {
    const file = join(dir, 'batch.jsonl');
    writeFileSync(file, items.map((i) => JSON.stringify({ prompt_id: i.promptId, prompt: i.prompt, responses: i.responses.map((r) => ({ response_id: r.responseId, text: r.text })) })).join('\n'));
    const rubric = loadRubricFile(new URL('../../rubrics/general.yaml', import.meta.url).pathname).rubric!;
    const draft = loadRubric(rubric.source.replace('overall_bands: { pass: 75, review: 50 }', 'overall_bands: { pass: 85, review: 60 }')).rubric!;

    const store = await openStore({ kind: 'sqlite', file: join(dir, 'bench.db') });
    await migrate(store);
    const { batchId, itemIds } = await storeBatch(store.db, { name: 'bench', sourceHash: 'bench', sourceName: 'batch.jsonl', items });
    await ensureRubricVersion(store.db, rubric);
    for (const [i, item] of items.entries()) {
      const rows = await store.db.selectFrom('responses').select(['id', 'response_id']).where('item_id', '=', itemIds[i]).execute();
      await storeItemScore(store.db, itemIds[i], scoreItem(rubric, { prompt: item.prompt, responses: item.responses }), new Map(rows.map((r) => [r.response_id, r.id])));
    }

    let t0 = performance.now();
    for await (const event of readBatch(createReadStream(file), file)) if (event.kind === 'item') scoreItem(rubric, { prompt: event.item.prompt, responses: event.item.responses });
    const fromFile = performance.now() - t0;
    t0 = performance.now();
    const impact = compareRubrics(rubric, draft, await loadBatchItems(store.db, batchId, rubric));
    const preview = performance.now() - t0;
    await store.close();
    return [
      { area: 'rubric', name: `score ${responses.toLocaleString('en')} responses from a JSONL file`, value: (responses / fromFile) * 1000, unit: 'responses/s' },
      { area: 'rubric', name: `impact preview re-scoring the same ${responses.toLocaleString('en')} stored responses (${impact.bandChanges.length} band changes)`, value: preview / 1000, unit: 's', ratio: preview / fromFile, target: '≤ 2× scoring from the file', pass: preview / fromFile <= 2 },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
