/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { stream } from 'hono/streaming';
import { HttpError } from '../../errors.ts';
import type { ImportJobs } from '../../io/import-jobs.ts';
import { decidedItems, pairsOf, rankingOf } from '../../io/export-decisions.ts';
import { listBatches } from '../../store/repos/batches.ts';
import { recordAudit } from '../../store/repos/audit.ts';
import { currentRubric, listRubrics } from '../../store/repos/rubrics.ts';
import { BatchesPage } from '../../../views/batches-page.tsx';
import { ImportJobPage, ImportProgressPanel } from '../../../views/import-job-page.tsx';
import type { AppEnv, SessionUser } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

/**
 * Upload a batch file from the browser (imported in the background, with a page that follows its
 * progress), and download final decisions as a streamed export.
 */
export function batchIoRoutes(imports: ImportJobs) {
  const app = new Hono<AppEnv>();

  app.post('/batches/import', requireRole('data', 'admin'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody();
    const file = body.file;
    const name = typeof body.name === 'string' ? body.name.trim() : '';
    const refuse = async (error: string) =>
      c.html(<BatchesPage user={c.get('user')!} csrfToken={c.get('csrfToken')} batches={await listBatches(db)} rubrics={await listRubrics(db)} error={error} />, 422);
    if (!(file instanceof File) || !file.size) return refuse('Choose a JSON Lines or CSV file to import.');
    if (!name) return refuse('Give the batch a name.');
    const rubric = await currentRubric(db, typeof body.rubric === 'string' && body.rubric ? body.rubric : 'general');
    if (!rubric) return refuse('Pick a rubric.');
    const reviews = body.reviews ? Number(body.reviews) : undefined;
    const rationaleMin = typeof body.rationale_min === 'string' && body.rationale_min !== '' ? Number(body.rationale_min) : undefined;
    if (rationaleMin !== undefined && (!Number.isInteger(rationaleMin) || rationaleMin < 0 || rationaleMin > 2000)) return refuse('The minimum rationale length must be a whole number of characters from 0 to 2000.');
    const format = /\.csv$/i.test(file.name) ? 'csv' : 'jsonl';
    const job = imports.start(c.get('store'), new Uint8Array(await file.arrayBuffer()), format, {
      fileName: file.name,
      ownerId: c.get('user')!.id,
      batchName: name,
      rubric,
      reviews: Number.isInteger(reviews) ? reviews : undefined,
      rationaleMin,
      createdBy: c.get('user')!.id,
    });
    return c.redirect(`/batches/imports/${job.id}`, 303);
  });

  /** The job, if the user may see it: whoever started it, or an admin. */
  const jobFor = (id: string, user: SessionUser) => {
    const job = imports.get(id);
    if (!job || (job.ownerId !== user.id && !user.roles.includes('admin'))) throw new HttpError(404, 'There is no such import. Imports are kept for this server\'s lifetime; see the batch list for what was stored.');
    return job;
  };

  app.get('/batches/imports/:id', requireRole('data', 'admin'), (c) =>
    c.html(<ImportJobPage user={c.get('user')!} csrfToken={c.get('csrfToken')} job={jobFor(c.req.param('id'), c.get('user')!)} />));

  app.get('/batches/imports/:id/progress', requireRole('data', 'admin'), (c) => c.html(<ImportProgressPanel job={jobFor(c.req.param('id'), c.get('user')!)} />));

  app.get('/export', requireRole('data', 'admin'), async (c) => {
    const { db } = c.get('store');
    const format = c.req.query('format') === 'rankings' ? 'rankings' : 'pairs';
    const batchName = c.req.query('batch') || undefined;
    const includeTies = c.req.query('ties') === '1';
    const redactPii = c.req.query('redact') === '1';
    if (batchName && !(await db.selectFrom('batches').select('id').where('name', '=', batchName).executeTakeFirst())) throw new HttpError(404, `There is no batch "${batchName}".`);
    await recordAudit(db, { actorId: c.get('user')!.id, kind: 'export', subject: batchName ? `batch:${batchName}` : 'all', detail: { format, includeTies, redactPii, via: 'web' } });
    c.header('Content-Type', 'application/x-ndjson; charset=utf-8');
    c.header('Content-Disposition', `attachment; filename="plumbline-${format}.jsonl"`);
    return stream(c, async (out) => {
      for await (const item of decidedItems(db, { format, batchName, includeTies, redactPii })) {
        const records = format === 'pairs' ? pairsOf(item, includeTies) : [rankingOf(item)];
        if (records.length) await out.write(records.map((r) => JSON.stringify(r)).join('\n') + '\n');
      }
    });
  });

  return app;
}
