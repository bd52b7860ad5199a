/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { listBatches } from '../../store/repos/batches.ts';
import { listRubrics } from '../../store/repos/rubrics.ts';
import { BatchesPage } from '../../../views/batches-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

/** The list of imported batches. */
export function batchRoutes() {
  const app = new Hono<AppEnv>();
  app.get('/batches', requireRole('data', 'admin', 'policy'), async (c) => {
    const batches = await listBatches(c.get('store').db);
    return c.html(<BatchesPage user={c.get('user')!} csrfToken={c.get('csrfToken')} batches={batches} rubrics={await listRubrics(c.get('store').db)} />);
  });
  return app;
}
