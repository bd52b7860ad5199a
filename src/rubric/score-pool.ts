import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { Rubric } from './load.ts';
import { scoreItem, type ItemScore, type ItemToScore } from './score.ts';

/** Scores items against one rubric, on worker threads or on the calling thread. */
export interface ScorePool {
  readonly threads: number;
  score(item: ItemToScore): Promise<ItemScore>;
  close(): Promise<void>;
}

/**
 * Worker threads to score with: `PLUMBLINE_SCORE_THREADS` when set (0 scores on the calling
 * thread), otherwise one per core but one (the calling thread parses and stores meanwhile), at
 * least one and at most four. Each thread holds its own language model and dictionaries
 * (about 100 MB), so more threads than cores costs memory and buys nothing.
 */
export function defaultScoreThreads(): number {
  const configured = process.env.PLUMBLINE_SCORE_THREADS;
  if (configured !== undefined && configured !== '') {
    const n = Number(configured);
    if (!Number.isInteger(n) || n < 0 || n > 64) throw new Error(`PLUMBLINE_SCORE_THREADS must be a whole number from 0 to 64, not "${configured}"`);
    return n;
  }
  return Math.max(1, Math.min(4, availableParallelism() - 1));
}

/** Below this many items a batch is scored on the calling thread: starting a worker costs more. */
export const WORKER_THRESHOLD = 50;

/**
 * A pool for `items` items: worker threads when there are enough items to be worth starting
 * them, the calling thread otherwise. Each worker loads the rubric from its source text, so
 * its version (a content hash) is the same as the caller's.
 */
export function scorePool(rubric: Rubric, items: number, threads = defaultScoreThreads()): ScorePool {
  if (threads === 0 || items < WORKER_THRESHOLD) return inlinePool(rubric);
  return workerPool(rubric, Math.min(threads, Math.ceil(items / WORKER_THRESHOLD)));
}

function inlinePool(rubric: Rubric): ScorePool {
  return {
    threads: 0,
    score: async (item) => scoreItem(rubric, item),
    close: async () => {},
  };
}

/**
 * Heap limits of a scoring thread. Left to itself V8 lets a busy thread's heap grow far past
 * what it holds (the model and dictionaries take about 60 MB; an item's analysis a few more):
 * measured on a 10,000-response import, these limits keep the process's peak near 320 MB
 * against 470 MB without them, for about 4% more time.
 */
const THREAD_HEAP = { maxOldGenerationSizeMb: 192, maxYoungGenerationSizeMb: 16 };

interface Waiting {
  resolve: (score: ItemScore) => void;
  reject: (error: Error) => void;
}

function workerPool(rubric: Rubric, threads: number): ScorePool {
  const bootstrap = new URL('./score-worker.mjs', import.meta.url);
  const waiting = new Map<number, Waiting>();
  const load = new Map<Worker, number>();
  let nextId = 0;
  let failure: Error | null = null;
  const fail = (error: Error) => {
    failure ??= error;
    for (const w of waiting.values()) w.reject(failure);
    waiting.clear();
  };
  const workers = Array.from({ length: threads }, () => {
    const worker = new Worker(bootstrap, { workerData: { rubricSource: rubric.source, rubricVersion: rubric.version }, resourceLimits: THREAD_HEAP });
    load.set(worker, 0);
    worker.on('message', (message: { id: number; score?: ItemScore; error?: string }) => {
      load.set(worker, load.get(worker)! - 1);
      const w = waiting.get(message.id);
      if (!w) return;
      waiting.delete(message.id);
      if (message.score) w.resolve(message.score);
      else w.reject(new Error(message.error ?? 'scoring failed'));
    });
    worker.on('error', (error) => fail(new Error(`a scoring thread failed: ${error.message}`)));
    worker.on('exit', (code) => {
      if (code !== 0) fail(new Error(`a scoring thread stopped (exit code ${code})`));
    });
    return worker;
  });
  return {
    threads,
    score(item) {
      if (failure) return Promise.reject(failure);
      const id = nextId++;
      // the least busy worker takes the item
      let target = workers[0];
      for (const w of workers) if (load.get(w)! < load.get(target)!) target = w;
      load.set(target, load.get(target)! + 1);
      return new Promise<ItemScore>((resolve, reject) => {
        waiting.set(id, { resolve, reject });
        target.postMessage({ id, item });
      });
    },
    async close() {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}
