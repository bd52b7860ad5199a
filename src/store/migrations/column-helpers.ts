import { PostgresAdapter, type CreateTableBuilder, type Kysely } from 'kysely';

/** True when the migration runs against PostgreSQL. */
export function isPostgres(db: Kysely<unknown>): boolean {
  return db.getExecutor().adapter instanceof PostgresAdapter;
}

/**
 * Adds an integer primary key the database assigns: `integer primary key autoincrement` on
 * SQLite, an identity column on PostgreSQL.
 */
export function withId<T extends string>(db: Kysely<unknown>, table: CreateTableBuilder<T, never>) {
  return table.addColumn('id', 'integer', (col) =>
    isPostgres(db) ? col.primaryKey().generatedByDefaultAsIdentity() : col.primaryKey().autoIncrement(),
  );
}
