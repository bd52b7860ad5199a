import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll } from 'vitest';
import { openStore, type Store } from '../../src/store/connect.ts';
import { migrate } from '../../src/store/migrate.ts';

/** A way to get a fresh, empty database of one kind, and to throw it away afterwards. */
export interface StoreFactory {
  kind: 'sqlite' | 'postgres';
  open(): Promise<Store>;
  /** Another connection (pool) to the database opened last: a second app instance. */
  openAgain(): Promise<Store>;
  cleanup(): Promise<void>;
}

const pgUrl = process.env.TEST_DATABASE_URL;

/**
 * The databases the store tests run on: SQLite always; PostgreSQL when TEST_DATABASE_URL is
 * set. With CI=true a missing PostgreSQL is an error rather than a silent skip.
 */
export function storeFactories(): StoreFactory[] {
  if (!pgUrl) {
    if (process.env.CI === 'true') {
      throw new Error('CI=true but TEST_DATABASE_URL is not set: the store tests must run on PostgreSQL too. Start PostgreSQL and export TEST_DATABASE_URL (see DEVELOPERS.md).');
    }
    console.warn('[plumbline tests] TEST_DATABASE_URL is not set: store tests run on SQLite only and SKIP PostgreSQL.');
    return [sqliteFactory()];
  }
  return [sqliteFactory(), postgresFactory(pgUrl)];
}

export function sqliteFactory(): StoreFactory {
  const dirs: string[] = [];
  return {
    kind: 'sqlite',
    async open() {
      const dir = mkdtempSync(join(tmpdir(), 'plumbline-test-'));
      dirs.push(dir);
      return openStore({ kind: 'sqlite', file: join(dir, 'test.db') });
    },
    async openAgain() {
      return openStore({ kind: 'sqlite', file: join(dirs.at(-1)!, 'test.db') });
    },
    async cleanup() {
      for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Each PostgreSQL store lives in a schema of its own, dropped at cleanup. */
export function postgresFactory(url: string): StoreFactory {
  const schemas: string[] = [];
  const inSchema = (schema: string) => {
    const withSchema = new URL(url);
    withSchema.searchParams.set('options', `-c search_path=${schema}`);
    return withSchema.toString();
  };
  return {
    kind: 'postgres',
    async openAgain() {
      return openStore({ kind: 'postgres', url: inSchema(schemas.at(-1)!) });
    },
    async open() {
      const schema = `plumbline_test_${randomBytes(6).toString('hex')}`;
      const admin = new pg.Client({ connectionString: url });
      await admin.connect();
      await admin.query(`create schema ${schema}`);
      await admin.end();
      schemas.push(schema);
      return openStore({ kind: 'postgres', url: inSchema(schema) });
    },
    async cleanup() {
      if (schemas.length === 0) return;
      const admin = new pg.Client({ connectionString: url });
      await admin.connect();
      for (const schema of schemas.splice(0)) await admin.query(`drop schema if exists ${schema} cascade`);
      await admin.end();
    },
  };
}

/**
 * A migrated store from `factory` for one describe block, opened before its tests and removed
 * after them. Read `fixture.store` inside tests.
 */
export function useMigratedStore(factory: StoreFactory): { store: Store } {
  const fixture = {} as { store: Store };
  beforeAll(async () => {
    fixture.store = await factory.open();
    await migrate(fixture.store);
  });
  afterAll(async () => {
    await fixture.store.close();
    await factory.cleanup();
  });
  return fixture;
}
