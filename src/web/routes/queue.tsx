/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { HttpError } from '../../errors.ts';
import { countItemsByState, listQueue } from '../../store/repos/queue.ts';
import { QueuePage, QueueTable } from '../../../views/queue-page.tsx';
import { ItemPage } from '../../../views/item-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

const ANY_ROLE = ['reviewer', 'adjudicator', 'policy', 'data', 'admin'] as const;

/** The home page (the triage queue) and the read-only item page. */
export function queueRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/', requireRole(...ANY_ROLE), async (c) => {
    const { db } = c.get('store');
    const batch = c.req.query('batch');
    const rows = await listQueue(db, { batchId: batch ? Number(batch) : undefined, flagged: c.req.query('flagged') === '1' });
    if (c.req.header('hx-request')) return c.html(<QueueTable rows={rows} />);
    const counts = await countItemsByState(db);
    return c.html(<QueuePage user={c.get('user')!} csrfToken={c.get('csrfToken')} rows={rows} counts={counts} />);
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
