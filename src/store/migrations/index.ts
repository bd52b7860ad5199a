import type { Migration, MigrationProvider } from 'kysely';
import * as core from './0001-core.ts';
import * as reviewWorkflow from './0002-review-workflow.ts';
import * as loginFailures from './0003-login-failures.ts';
import * as queueFilters from './0004-queue-filters.ts';

/**
 * Every migration, in order. Names sort by their number; add a new file
 * `NNNN-name.ts` with `up` and `down` and list it here.
 */
export const migrations: Record<string, Migration> = {
  '0001-core': core,
  '0002-review-workflow': reviewWorkflow,
  '0003-login-failures': loginFailures,
  '0004-queue-filters': queueFilters,
};

/** Kysely reads migrations through a provider; ours is the static list above. */
export const migrationProvider: MigrationProvider = {
  getMigrations: async () => migrations,
};
