import { UserError } from './errors.ts';

/** Where the data lives: an SQLite file (default) or a PostgreSQL URL. */
export type DatabaseTarget =
  | { kind: 'sqlite'; file: string }
  | { kind: 'postgres'; url: string };

export interface Config {
  database: DatabaseTarget;
  host: string;
  port: number;
  /** Set cookies with the Secure flag (serve behind HTTPS). */
  secureCookies: boolean;
  debug: boolean;
}

export const DEFAULT_DB_FILE = './data/plumbline.db';
export const DEFAULT_HOST = '127.0.0.1';
export const DEFAULT_PORT = 8787;

/**
 * Reads the database target from the environment. `DATABASE_URL` (postgres://…) wins over
 * `PLUMBLINE_DB` (an SQLite file path). A malformed URL is a `UserError` naming the variable.
 *
 * @example
 * databaseFromEnv({ DATABASE_URL: 'postgres://127.0.0.1/test' }) // { kind: 'postgres', … }
 */
export function databaseFromEnv(env: NodeJS.ProcessEnv): DatabaseTarget {
  const url = env.DATABASE_URL?.trim();
  if (url) return { kind: 'postgres', url: checkPostgresUrl(url, 'DATABASE_URL') };
  return { kind: 'sqlite', file: env.PLUMBLINE_DB?.trim() || DEFAULT_DB_FILE };
}

/** Validates a PostgreSQL connection URL and returns it unchanged. */
export function checkPostgresUrl(url: string, variable: string): string {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    throw new UserError(
      `${variable} is not a valid URL ("${redact(url)}") — use the form postgres://user@host:5432/database`,
    );
  }
  if (parsed.protocol !== 'postgres:' && parsed.protocol !== 'postgresql:') {
    throw new UserError(
      `${variable} must start with postgres:// or postgresql:// (found "${parsed.protocol}//") — leave it unset to use the SQLite file`,
    );
  }
  if (!parsed.hostname) {
    throw new UserError(`${variable} names no host — use the form postgres://user@host:5432/database`);
  }
  return url;
}

/** Reads the whole server configuration from the environment. */
export function configFromEnv(env: NodeJS.ProcessEnv): Config {
  return {
    database: databaseFromEnv(env),
    host: env.HOST?.trim() || DEFAULT_HOST,
    port: parsePort(env.PORT),
    secureCookies: env.PLUMBLINE_SECURE_COOKIES === '1' || env.PLUMBLINE_SECURE_COOKIES === 'true',
    debug: Boolean(env.DEBUG),
  };
}

function parsePort(raw: string | undefined): number {
  if (raw === undefined || raw.trim() === '') return DEFAULT_PORT;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new UserError(`PORT "${raw}" is not a port number — set PORT to a whole number from 1 to 65535`);
  }
  return port;
}

/** Hides a password in a connection URL before it is printed. */
export function redact(url: string): string {
  return url.replace(/(\/\/[^:/@]*:)[^@/]*@/, '$1***@');
}
