import { errorCode } from '../errors.ts';

/** A database failure a person can act on: what happened, and that the action was not saved. */
export interface StorageFailure {
  kind: 'full' | 'unreachable' | 'busy';
  message: string;
}

/** PostgreSQL and socket codes that mean the connection to the database was lost or refused. */
const CONNECTION_LOST = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', '57P01', '57P02', '57P03', '08000', '08003', '08006', '08001', '08004']);

/**
 * Reads a database error as a storage failure, or null when it is something else (a bug, a
 * constraint the code should have checked). The messages say that nothing of the action was
 * kept: every write runs in a transaction, so a failed one leaves the database as it was.
 */
export function storageFailure(error: unknown): StorageFailure | null {
  const code = errorCode(error);
  const text = error instanceof Error ? error.message : String(error);
  if (code === 'SQLITE_FULL' || code === '53100' || /database or disk is full|No space left on device/i.test(text)) {
    return { kind: 'full', message: 'The database is full (no disk space left, or its size limit reached). Nothing of this action was saved, and nothing already stored was lost. Ask an administrator to free space, then try again.' };
  }
  if ((code && CONNECTION_LOST.has(code)) || /Connection terminated|connection is closed|terminating connection|Client has encountered a connection error/i.test(text)) {
    return { kind: 'unreachable', message: 'The connection to the database was lost. Nothing of this action was saved, and nothing already stored was lost. Try again in a moment; if it keeps failing, ask an administrator to check the database server.' };
  }
  if (code === 'SQLITE_BUSY' || code === '40001' || code === '40P01') {
    return { kind: 'busy', message: 'The database was too busy to take this action just now. Nothing of it was saved. Try again.' };
  }
  return null;
}
