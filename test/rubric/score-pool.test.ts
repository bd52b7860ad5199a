import { readFileSync } from 'node:fs';
import { afterEach, describe, expect, it } from 'vitest';
import { cairnfieldItems } from '../../src/demo/cairnfield-items.ts';
import { loadRubric, type Rubric } from '../../src/rubric/load.ts';
import { scoreItem } from '../../src/rubric/score.ts';
import { defaultScoreThreads, scorePool, WORKER_THRESHOLD, type ScorePool } from '../../src/rubric/score-pool.ts';

const rubric = loadRubric(readFileSync(new URL('../../rubrics/cairnfield-support.yaml', import.meta.url), 'utf8')).rubric as Rubric;
const items = Array.from({ length: 2 * WORKER_THRESHOLD }, (_, i) => cairnfieldItems[i % cairnfieldItems.length]).map((d, i) => ({
  prompt: d.prompt,
  responses: d.responses.map((text, k) => ({ responseId: `r${i}-${k}`, text })),
  flagSeverity: d.flag?.severity ?? null,
}));

let pool: ScorePool | null = null;
afterEach(async () => {
  await pool?.close();
  pool = null;
  delete process.env.PLUMBLINE_SCORE_THREADS;
});

describe('scoring on worker threads', () => {
  it('gives exactly the scores of the calling thread, item for item', async () => {
    pool = scorePool(rubric, items.length, 2);
    expect(pool.threads).toBe(2);
    const scores = await Promise.all(items.map((item) => pool!.score(item)));
    expect(scores).toEqual(items.map((item) => scoreItem(rubric, item)));
  });

  it.each([
    ['a small batch', WORKER_THRESHOLD - 1, 4, 0],
    ['threads set to 0', 1000, 0, 0],
    ['a batch just large enough for one thread', WORKER_THRESHOLD, 4, 1],
  ])('scores %s with %s items and %s threads asked for on %s worker threads', async (_what, count, asked, threads) => {
    pool = scorePool(rubric, count, asked);
    expect(pool.threads).toBe(threads);
    expect(await pool.score(items[0])).toEqual(scoreItem(rubric, items[0]));
  });

  it('reads PLUMBLINE_SCORE_THREADS and refuses a bad value with its name', () => {
    process.env.PLUMBLINE_SCORE_THREADS = '3';
    expect(defaultScoreThreads()).toBe(3);
    process.env.PLUMBLINE_SCORE_THREADS = 'many';
    expect(() => defaultScoreThreads()).toThrow(/PLUMBLINE_SCORE_THREADS must be a whole number from 0 to 64, not "many"/);
  });
});
