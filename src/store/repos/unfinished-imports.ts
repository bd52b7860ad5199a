import { hostname } from 'node:os';
import type { Kysely } from 'kysely';
import type { Database } from '../schema.ts';

/** An import whose owner has made no progress for this long is taken to have died. */
export const IMPORT_STALE_MS = 10 * 60 * 1000;

/** Who is importing: this host and process, so a restart on the same host can tell a dead import from a live one. */
export function importOwner(): string {
  return `${hostname()}:${process.pid}`;
}

function alive(owner: string): boolean {
  const [host, pid] = [owner.slice(0, owner.lastIndexOf(':')), Number(owner.slice(owner.lastIndexOf(':') + 1))];
  if (host !== hostname() || !Number.isInteger(pid)) return true; // another machine: only staleness tells
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes batches whose import stopped part-way (the process was killed, the machine lost
 * power): their owner on this host is gone, or nobody has made progress on them for
 * IMPORT_STALE_MS. Their staged items were never shown; deleting the batch deletes them, their
 * responses and scores (foreign keys cascade). Returns the names removed.
 */
export async function sweepUnfinishedImports(db: Kysely<Database>, now = Date.now()): Promise<string[]> {
  const unfinished = await db.selectFrom('batches').select(['id', 'name', 'import_owner', 'import_heartbeat_at']).where('import_owner', 'is not', null).execute();
  const dead = unfinished.filter((b) => !alive(b.import_owner!) || now - Date.parse(b.import_heartbeat_at ?? '') > IMPORT_STALE_MS);
  for (const batch of dead) await db.deleteFrom('batches').where('id', '=', batch.id).where('import_owner', 'is not', null).execute();
  return dead.map((b) => b.name);
}
