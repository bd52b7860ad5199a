import { mkdirSync, accessSync, constants as fsConstants } from 'node:fs';
import { dirname, resolve } from 'node:path';
import SqliteDatabase from 'better-sqlite3';
import pg from 'pg';
import { Kysely, PostgresDialect, SqliteDialect } from 'kysely';
import type { DatabaseTarget } from '../config.ts';
import { redact } from '../config.ts';
import { UserError, errorCode } from '../errors.ts';
import type { Database } from './schema.ts';

/** An open database: the typed query builder plus what kind it is. */
export interface Store {
  db: Kysely<Database>;
  kind: DatabaseTarget['kind'];
  /** Human-readable place, with any password hidden. */
  where: string;
  /** PostgreSQL: the schema the connection works in (migration bookkeeping lives there too). */
  schema?: string;
  close(): Promise<void>;
}

/** PostgreSQL returns bigint (count(*)) as a string; ours never exceed 2^53, so read them as numbers. */
pg.types.setTypeParser(20, (value: string) => Number(value));

/**
 * Opens the database named by `target`. SQLite: the file and its folder are created, WAL
 * journaling, foreign keys and a busy timeout are switched on. PostgreSQL: a pool is opened
 * and one round trip proves the server answers. Failures are `UserError`s that say what to fix.
 *
 * @example
 * const store = await openStore({ kind: 'sqlite', file: './data/plumbline.db' });
 */
export async function openStore(target: DatabaseTarget): Promise<Store> {
  return target.kind === 'sqlite' ? openSqlite(target.file) : openPostgres(target.url);
}

function openSqlite(file: string): Store {
  const path = file === ':memory:' ? file : resolve(file);
  let sqlite: SqliteDatabase.Database;
  try {
    if (path !== ':memory:') {
      mkdirSync(dirname(path), { recursive: true });
      accessSync(dirname(path), fsConstants.W_OK);
    }
    sqlite = new SqliteDatabase(path);
    sqlite.pragma('journal_mode = WAL');
    sqlite.pragma('foreign_keys = ON');
    sqlite.pragma('busy_timeout = 5000');
    sqlite.pragma('synchronous = NORMAL');
  } catch (error) {
    throw new UserError(sqliteOpenMessage(path, error));
  }
  const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: withStatementCache(sqlite) }) });
  return { db, kind: 'sqlite', where: path, close: () => db.destroy() };
}

/** Prepared statements kept per SQL text; the least recently used go first. */
const STATEMENT_CACHE = 256;

/**
 * The SQLite connection as Kysely sees it, with prepared statements reused: preparing costs
 * as much as running a small indexed query, and a page runs the same few statements every time.
 * Reuse is safe because Kysely runs one query at a time on the one SQLite connection.
 */
function withStatementCache(sqlite: SqliteDatabase.Database) {
  const cache = new Map<string, SqliteDatabase.Statement>();
  return {
    close: () => sqlite.close(),
    prepare(sql: string) {
      let statement = cache.get(sql);
      if (statement) {
        cache.delete(sql);
      } else {
        statement = sqlite.prepare(sql);
        if (cache.size >= STATEMENT_CACHE) cache.delete(cache.keys().next().value!);
      }
      cache.set(sql, statement);
      return statement;
    },
  };
}

function sqliteOpenMessage(path: string, error: unknown): string {
  const code = errorCode(error);
  if (code === 'EACCES' || code === 'EPERM' || code === 'EROFS' || code === 'SQLITE_CANTOPEN' || code === 'SQLITE_READONLY') {
    return `cannot write the database file ${path} (${code}) — set PLUMBLINE_DB to a path in a folder you can write to`;
  }
  if (code === 'ENOTDIR' || code === 'EEXIST') {
    return `cannot create the database file ${path}: part of the path is a file, not a folder — set PLUMBLINE_DB to another path`;
  }
  if (code === 'SQLITE_NOTADB' || code === 'SQLITE_CORRUPT') {
    return `${path} is not a Plumbline database (${code}) — set PLUMBLINE_DB to a new path or restore the file from a backup`;
  }
  const reason = error instanceof Error ? error.message : String(error);
  return `cannot open the database file ${path}: ${reason} — set PLUMBLINE_DB to a writable path`;
}

async function openPostgres(url: string): Promise<Store> {
  const pool = new pg.Pool({ connectionString: url, max: 10, connectionTimeoutMillis: 5000 });
  // An idle client that loses its connection emits 'error' on the pool; without a listener
  // that would end the process. Queries on a lost connection fail and are reported instead.
  pool.on('error', () => {});
  // The same holds for a client in use: a connection cut mid-query emits 'error' on the client
  // as well as failing the query. The failed query reports it; the event must not end the process.
  pool.on('connect', (client) => client.on('error', () => {}));
  let schema: string;
  try {
    const client = await pool.connect();
    try {
      schema = (await client.query<{ schema: string }>('select current_schema() as schema')).rows[0].schema;
    } finally {
      client.release();
    }
  } catch (error) {
    await pool.end().catch(() => {});
    throw new UserError(postgresConnectMessage(url, error));
  }
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  return { db, kind: 'postgres', where: redact(url), schema, close: () => db.destroy() };
}

function postgresConnectMessage(url: string, error: unknown): string {
  const place = redact(url);
  const code = errorCode(error);
  const reason = error instanceof Error ? error.message : String(error);
  if (code === 'ECONNREFUSED' || code === 'ENOTFOUND' || code === 'EAI_AGAIN' || code === 'ETIMEDOUT' || /timeout/i.test(reason)) {
    return `cannot reach PostgreSQL at ${place} (${code ?? 'timed out'}) — check DATABASE_URL and that the server is running`;
  }
  if (code === '3D000') return `PostgreSQL at ${place} has no such database — create it or fix the name in DATABASE_URL`;
  if (code === '28P01' || code === '28000') return `PostgreSQL at ${place} refused the login (${reason}) — check the user and password in DATABASE_URL`;
  return `cannot connect to PostgreSQL at ${place}: ${reason} — check DATABASE_URL`;
}
