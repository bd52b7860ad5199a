/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { HttpError } from '../../errors.ts';
import { batchNames, countItemsByState, listQueue, type QueueFilter } from '../../store/repos/queue.ts';
import { CHECK_IDS } from '../../checks/registry.ts';
import { BAND_NAMES, type Band } from '../../rubric/spec.ts';
import { QueuePage, QueueTable } from '../../../views/queue-page.tsx';
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

/** The home page (the triage queue) and the read-only item page. */
export function queueRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/', requireRole(...ANY_ROLE), async (c) => {
    const { db } = c.get('store');
    const filter = queueFilterFrom(c.req.query());
    const rows = await listQueue(db, filter);
    if (c.req.header('hx-request')) return c.html(<QueueTable rows={rows} />);
    const [counts, batches] = await Promise.all([countItemsByState(db), batchNames(db)]);
    return c.html(<QueuePage user={c.get('user')!} csrfToken={c.get('csrfToken')} rows={rows} counts={counts} filter={filter} batches={batches} checks={CHECK_IDS} />);
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
