/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { HttpError } from '../../errors.ts';
import { rubricSourceWithWeights } from '../../rubric/with-weights.ts';
import { learnWeights } from '../../stats/learn-weights.ts';
import { listBatches } from '../../store/repos/batches.ts';
import { loadCalibrationItems } from '../../store/repos/calibration-data.ts';
import { currentRubric } from '../../store/repos/rubrics.ts';
import { batchStatistics } from '../../store/repos/statistics-data.ts';
import { StatsPage, WeightsPage } from '../../../views/stats-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

/** Statistics per batch or overall, and learned weights offered as a rubric draft. */
export function statsRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/stats', requireRole('policy', 'admin', 'data', 'adjudicator'), async (c) => {
    const { db } = c.get('store');
    const batches = await listBatches(db);
    const raw = c.req.query('batch');
    const selected = raw && raw !== 'all' ? Number(raw) : null;
    if (selected !== null && !batches.some((b) => b.id === selected)) throw new HttpError(404, 'There is no such batch. Pick one from the list.');
    const rubricId = selected !== null ? ((await db.selectFrom('batches').select('rubric_id').where('id', '=', selected).executeTakeFirst())?.rubric_id ?? null) : null;
    return c.html(<StatsPage user={c.get('user')!} csrfToken={c.get('csrfToken')} batches={batches} selected={selected} stats={await batchStatistics(db, selected)} rubricId={rubricId} />);
  });

  app.post('/stats/weights', requireRole('policy'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody();
    const batch = await db.selectFrom('batches').select(['id', 'name', 'rubric_id']).where('id', '=', Number(body.batch) || -1).executeTakeFirst();
    if (!batch?.rubric_id) throw new HttpError(422, 'Pick a batch that was scored with a rubric.');
    const rubric = await currentRubric(db, batch.rubric_id);
    if (!rubric) throw new HttpError(404, `The rubric "${batch.rubric_id}" is no longer available.`);
    const items = await loadCalibrationItems(db, batch.id);
    const learned = learnWeights(rubric, items);
    if (learned.pairs < 10) throw new HttpError(422, `Only ${learned.pairs} decided pairs in "${batch.name}": too few to fit weights. Decide more items first.`);
    const current = Object.fromEntries(rubric.criteria.map((k) => [k.id, k.weight]));
    return c.html(<WeightsPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={rubric.id} batchName={batch.name} learned={learned} current={current} draft={rubricSourceWithWeights(rubric.source, learned.suggested)} />);
  });

  return app;
}
