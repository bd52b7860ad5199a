import { Hono } from 'hono';
import { HttpError, UserError } from '../../errors.ts';
import { importUploaded, ImportRefused } from '../../io/import-batch.ts';
import { currentRubric } from '../../store/repos/rubrics.ts';
import type { AppEnv } from '../context.ts';
import { requireToken, type RateLimit } from '../middleware/api-token.ts';

/** The HTTP API: `POST /api/v1/batches` imports a JSONL or CSV batch (token scope "import"). */
export function apiRoutes(options: { rateLimit?: RateLimit } = {}) {
  const app = new Hono<AppEnv>();
  app.post('/api/v1/batches', requireToken('import', options.rateLimit), async (c) => {
    const name = c.req.query('name')?.trim();
    if (!name) throw new HttpError(422, 'Name the batch with ?name=…');
    const type = c.req.header('content-type') ?? '';
    const extension = type.includes('csv') ? 'csv' : type.includes('json') ? 'jsonl' : null;
    if (!extension) throw new HttpError(415, 'Send the batch as application/x-ndjson (JSON Lines) or text/csv.');
    const reviews = c.req.query('reviews') ? Number(c.req.query('reviews')) : undefined;
    if (reviews !== undefined && (!Number.isInteger(reviews) || reviews < 1 || reviews > 5)) throw new HttpError(422, 'reviews must be a whole number from 1 to 5.');
    const rationaleMin = c.req.query('rationale_min') ? Number(c.req.query('rationale_min')) : undefined;
    if (rationaleMin !== undefined && (!Number.isInteger(rationaleMin) || rationaleMin < 0 || rationaleMin > 2000)) throw new HttpError(422, 'rationale_min must be a whole number of characters from 0 to 2000.');
    const rubric = await currentRubric(c.get('store').db, c.req.query('rubric') ?? 'general');
    if (!rubric) throw new HttpError(422, `There is no rubric "${c.req.query('rubric')}".`);
    try {
      const token = c.get('apiToken')!;
      const result = await importUploaded(c.get('store'), new Uint8Array(await c.req.arrayBuffer()), extension, { displayName: `api:${token.name}`, batchName: name, rubric, reviews, rationaleMin, createdBy: token.createdBy });
      return c.json({ batch_id: result.batchId, items: result.items, responses: result.responses, rubric: { id: rubric.id, version: rubric.version } }, 201);
    } catch (error) {
      if (error instanceof ImportRefused) return c.json({ error: 'nothing was imported: fix these lines and send the file again', problems: error.problems.map((p) => ({ line: p.line, field: p.field, reason: p.message })) }, 422);
      if (error instanceof UserError) return c.json({ error: error.message }, 409);
      throw error;
    }
  });
  return app;
}
