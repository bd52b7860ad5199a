import { randomUUID } from 'node:crypto';
import { UserError } from '../errors.ts';
import { storageFailure } from '../store/storage-failure.ts';
import type { Store } from '../store/connect.ts';
import type { LineProblem } from './batch-format.ts';
import { importUploaded, ImportRefused, type ImportOptions, type ImportProgress, type ImportResult } from './import-batch.ts';

/** An import started from the browser, followed by its page while it runs. */
export interface ImportJob {
  id: string;
  ownerId: number;
  batchName: string;
  fileName: string;
  state: 'running' | 'done' | 'refused' | 'failed';
  progress: ImportProgress;
  result?: ImportResult;
  /** What went wrong, for a person (refused or failed). */
  error?: string;
  problems?: LineProblem[];
  startedAt: number;
  finishedAt?: number;
}

/** Finished jobs kept for their pages; the oldest go first. */
const KEEP_FINISHED = 100;

/**
 * Imports running in the background of the web app, one record each. The import itself is the
 * CLI's (`importUploaded`): all or nothing, so a job that fails leaves the database as it was.
 */
export class ImportJobs {
  private readonly jobs = new Map<string, ImportJob>();

  start(store: Store, bytes: Uint8Array, format: 'jsonl' | 'csv', options: Omit<ImportOptions, 'path' | 'onProgress'> & { ownerId: number; fileName: string }): ImportJob {
    const job: ImportJob = {
      id: randomUUID(),
      ownerId: options.ownerId,
      batchName: options.batchName,
      fileName: options.fileName,
      state: 'running',
      progress: { phase: 'checking', done: 0, total: null },
      startedAt: Date.now(),
    };
    this.jobs.set(job.id, job);
    this.prune();
    importUploaded(store, bytes, format, { ...options, displayName: options.fileName, onProgress: (p) => (job.progress = p) })
      .then((result) => {
        job.state = 'done';
        job.result = result;
        job.progress = { phase: 'storing', done: result.items, total: result.items };
      })
      .catch((error: unknown) => {
        if (error instanceof ImportRefused) {
          job.state = 'refused';
          job.problems = error.problems;
          job.error = `Nothing was imported: ${error.problems.length} problem(s) in ${options.fileName}. Fix these lines and upload the file again.`;
        } else {
          job.state = 'failed';
          const failure = storageFailure(error);
          job.error = error instanceof UserError ? error.message : failure ? `The import stopped and stored nothing: ${failure.message}` : `The import stopped and stored nothing: ${error instanceof Error ? error.message : String(error)}. Try again; if it fails again, ask an administrator to look at the server log.`;
          if (!(error instanceof UserError) && !failure) console.error(error);
        }
      })
      .finally(() => (job.finishedAt = Date.now()));
    return job;
  }

  get(id: string): ImportJob | undefined {
    return this.jobs.get(id);
  }

  /** Resolves once the job has finished (for tests and the API). */
  async settled(id: string, timeoutMs = 60_000): Promise<ImportJob> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const job = this.jobs.get(id);
      if (!job) throw new Error(`no import job ${id}`);
      if (job.state !== 'running') return job;
      if (Date.now() > deadline) throw new Error(`import job ${id} still running after ${timeoutMs} ms`);
      await new Promise((r) => setTimeout(r, 20));
    }
  }

  private prune(): void {
    const finished = [...this.jobs.values()].filter((j) => j.state !== 'running');
    for (const job of finished.slice(0, Math.max(0, finished.length - KEEP_FINISHED))) this.jobs.delete(job.id);
  }
}
