import { Migrator, type MigrationResult } from 'kysely';
import { UserError } from '../errors.ts';
import { migrationProvider, migrations } from './migrations/index.ts';
import type { Store } from './connect.ts';

export interface MigrationStatus {
  name: string;
  executedAt: string | null;
}

function migrator(store: Store): Migrator {
  return new Migrator({ db: store.db, provider: migrationProvider, migrationTableSchema: store.schema });
}

/**
 * Brings the database to the newest schema, or to `target` (a migration name) when given.
 * Returns one result per migration step run; a failed step is a `UserError` naming it.
 */
export async function migrate(store: Store, target?: string): Promise<MigrationResult[]> {
  const m = migrator(store);
  const { error, results } = target ? await m.migrateTo(target) : await m.migrateToLatest();
  if (error) {
    const failed = results?.find((r) => r.status === 'Error')?.migrationName ?? 'unknown';
    const reason = error instanceof Error ? error.message : String(error);
    throw new UserError(`database migration "${failed}" failed on ${store.where}: ${reason} — nothing after it was applied; restore a backup or report this`);
  }
  return results ?? [];
}

/** Every known migration with the time it ran, or null when still pending. */
export async function migrationStatus(store: Store): Promise<MigrationStatus[]> {
  const known = await migrator(store).getMigrations();
  return known.map((m) => ({ name: m.name, executedAt: m.executedAt ? m.executedAt.toISOString() : null }));
}

/** The name of the newest migration this code knows. */
export const latestMigration = Object.keys(migrations).sort().at(-1)!;
