import { parentPort, workerData } from 'node:worker_threads';
import { loadRubric } from './load.ts';
import { scoreItem, type ItemToScore } from './score.ts';

/**
 * The scoring thread's side of `score-pool.ts` (started by score-worker.mjs): loads the rubric
 * once, then scores each item it is sent.
 */
export function serveScoring(): void {
  if (!parentPort) throw new Error('serveScoring runs on a worker thread started by score-pool.ts');
  const port = parentPort;
  const { rubricSource, rubricVersion } = workerData as { rubricSource: string; rubricVersion: string };
  const { rubric, problems } = loadRubric(rubricSource);
  if (!rubric || rubric.version !== rubricVersion) {
    throw new Error(`the scoring thread could not load rubric version ${rubricVersion} (${problems.length} problem(s))`);
  }
  port.on('message', ({ id, item }: { id: number; item: ItemToScore }) => {
    try {
      port.postMessage({ id, score: scoreItem(rubric, item) });
    } catch (error) {
      port.postMessage({ id, error: error instanceof Error ? error.message : String(error) });
    }
  });
}
