/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { raw } from 'hono/html';
import { QueueTableCache } from '../queue-table-cache.ts';
import type { Kysely } from 'kysely';
import type { Database, ItemState } from '../../store/schema.ts';
import { HttpError } from '../../errors.ts';
import { batchNames, countItemsByState, listQueue, type QueueFilter } from '../../store/repos/queue.ts';
import { CHECK_IDS } from '../../checks/registry.ts';
import { BAND_NAMES, type Band } from '../../rubric/spec.ts';
import { QueueFilters, QueuePage, QueueTable } from '../../../views/queue-page.tsx';
import { ItemPage } from '../../../views/item-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

const ANY_ROLE = ['reviewer', 'adjudicator', 'policy', 'data', 'admin'] as const;

/** The queue's filters from the query string; a value that is not one of the choices is a 400 naming it. */
export function queueFilterFrom(query: Record<string, string>): QueueFilter {
  const filter: QueueFilter = {};
  if (query.batch) {
    if (!/^[0-9]+$/.test(query.batch)) throw new HttpError(400, `batch must be a batch number, not "${query.batch}". Pick a batch from the list.`);
    filter.batchId = Number(query.batch);
  }
  if (query.band) {
    if (!(BAND_NAMES as readonly string[]).includes(query.band)) throw new HttpError(400, `band must be one of ${BAND_NAMES.join(', ')}, not "${query.band}".`);
    filter.band = query.band as Band;
  }
  if (query.check) {
    if (!CHECK_IDS.includes(query.check)) throw new HttpError(400, `check must be one of ${CHECK_IDS.join(', ')}, not "${query.check}".`);
    filter.check = query.check;
  }
  if (query.flagged === '1') filter.flagged = true;
  return filter;
}

/** How old the queue page's counts by state may be. Counting reads every item's index entry. */
const COUNTS_MAX_AGE_MS = 2000;
const recentCounts = new WeakMap<object, { at: number; counts: Promise<Record<ItemState, number>> }>();

/** Items per state, counted at most COUNTS_MAX_AGE_MS ago (a summary, not a record). */
function recentStateCounts(db: Kysely<Database>): Promise<Record<ItemState, number>> {
  const cached = recentCounts.get(db);
  if (cached && Date.now() - cached.at < COUNTS_MAX_AGE_MS) return cached.counts;
  const counts = countItemsByState(db);
  recentCounts.set(db, { at: Date.now(), counts });
  counts.catch(() => recentCounts.delete(db));
  return counts;
}

/** The home page (the triage queue) and the read-only item page. */
export function queueRoutes() {
  const app = new Hono<AppEnv>();

  const tables = new QueueTableCache();

  app.get('/', requireRole(...ANY_ROLE), async (c) => {
    const { db } = c.get('store');
    const filter = queueFilterFrom(c.req.query());
    const key = JSON.stringify(filter);
    const stamp = await tables.stamp(db);
    const table = raw(await tables.get(stamp, `table ${key}`, async () => String(await (<QueueTable rows={await listQueue(db, filter)} />).toString())));
    if (c.req.header('hx-request')) return c.html(table);
    const [counts, filters] = await Promise.all([
      recentStateCounts(db),
      tables.get(stamp, `filters ${key}`, async () => String(await (<QueueFilters filter={filter} batches={await batchNames(db)} checks={CHECK_IDS} />).toString())),
    ]);
    return c.html(<QueuePage user={c.get('user')!} csrfToken={c.get('csrfToken')} table={table} filters={raw(filters)} counts={counts} filter={filter} />);
  });

  app.get('/items/:id{[0-9]+}', requireRole(...ANY_ROLE), async (c) => {
    const { db } = c.get('store');
    const id = Number(c.req.param('id'));
    const item = await db.selectFrom('items').selectAll().where('id', '=', id).executeTakeFirst();
    if (!item) throw new HttpError(404, `There is no item ${id}. It may have been removed; go back to the queue.`);
    const batch = await db.selectFrom('batches').select('name').where('id', '=', item.batch_id).executeTakeFirstOrThrow();
    const responses = await db.selectFrom('responses').selectAll().where('item_id', '=', id).orderBy('position').execute();
    return c.html(<ItemPage user={c.get('user')!} csrfToken={c.get('csrfToken')} item={item} batchName={batch.name} responses={responses} />);
  });

  return app;
}
