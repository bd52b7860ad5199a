import { sql, type Kysely } from 'kysely';
import type { Database } from '../store/schema.ts';

/** A cached table is rebuilt at least this often, whatever the stamp says. */
const MAX_AGE_MS = 5000;
/** Filters kept; the least recently used go first. */
const MAX_ENTRIES = 200;

/**
 * The newest row of each table whose inserts change what the queue shows: items (imports),
 * reviews (submissions, skips and escalations change an item's state and review count),
 * adjudications (final decisions) and scores (priority). Every change to the queue inserts into
 * one of them, so an unchanged stamp means an unchanged queue, on every app instance.
 */
async function queueStamp(db: Kysely<Database>): Promise<string> {
  const { rows } = await sql<{ i: number | null; r: number | null; a: number | null; s: number | null }>`select (select max(id) from items) as i, (select max(id) from reviews) as r, (select max(id) from adjudications) as a, (select max(id) from scores) as s`.execute(db);
  const row = rows[0];
  return `${row?.i}:${row?.r}:${row?.a}:${row?.s}`;
}

/**
 * Parts of the queue page (the table, the filter form) per filter, reused while the data under
 * them is unchanged. Every reviewer sees the same queue, and a busy team reloads it far more
 * often than it changes: serving the stored parts costs one indexed query instead of reading
 * and rendering 50 items. Read `stamp(db)` once per request and pass it to each `get`.
 */
export class QueueTableCache {
  private readonly entries = new Map<string, { stamp: string; at: number; html: string }>();

  stamp(db: Kysely<Database>): Promise<string> {
    return queueStamp(db);
  }

  async get(stamp: string, key: string, build: () => Promise<string>): Promise<string> {
    const entry = this.entries.get(key);
    const now = Date.now();
    if (entry && entry.stamp === stamp && now - entry.at < MAX_AGE_MS) return entry.html;
    const html = await build();
    this.entries.delete(key);
    if (this.entries.size >= MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value!);
    this.entries.set(key, { stamp, at: now, html });
    return html;
  }
}
