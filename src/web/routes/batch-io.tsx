/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { stream } from 'hono/streaming';
import { HttpError, UserError } from '../../errors.ts';
import { importUploaded, ImportRefused } from '../../io/import-batch.ts';
import { decidedItems, pairsOf, rankingOf } from '../../io/export-decisions.ts';
import { listBatches } from '../../store/repos/batches.ts';
import { recordAudit } from '../../store/repos/audit.ts';
import { currentRubric, listRubrics } from '../../store/repos/rubrics.ts';
import { BatchesPage } from '../../../views/batches-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

/** Upload a batch file from the browser, and download final decisions as a streamed export. */
export function batchIoRoutes() {
  const app = new Hono<AppEnv>();

  app.post('/batches/import', requireRole('data', 'admin'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody();
    const file = body.file;
    const name = typeof body.name === 'string' ? body.name.trim() : '';
    const render = async (status: 201 | 409 | 422, message: { ok?: string; error?: string; problems?: { line: number; field: string | null; message: string }[] }) =>
      c.html(<BatchesPage user={c.get('user')!} csrfToken={c.get('csrfToken')} batches={await listBatches(db)} rubrics={await listRubrics(db)} {...message} />, status);
    if (!(file instanceof File) || !file.size) return render(422, { error: 'Choose a JSON Lines or CSV file to import.' });
    if (!name) return render(422, { error: 'Give the batch a name.' });
    const rubric = await currentRubric(db, typeof body.rubric === 'string' && body.rubric ? body.rubric : 'general');
    if (!rubric) return render(422, { error: 'Pick a rubric.' });
    const reviews = body.reviews ? Number(body.reviews) : undefined;
    try {
      const format = /\.csv$/i.test(file.name) ? 'csv' : 'jsonl';
      const result = await importUploaded(c.get('store'), new Uint8Array(await file.arrayBuffer()), format, { displayName: file.name, batchName: name, rubric, reviews: Number.isInteger(reviews) ? reviews : undefined, createdBy: c.get('user')!.id });
      return render(201, { ok: `Imported "${name}": ${result.items} prompts and ${result.responses} responses, scored with ${rubric.id} ${rubric.version}.` });
    } catch (error) {
      if (error instanceof ImportRefused) return render(422, { error: `Nothing was imported: ${error.problems.length} problem(s) in ${file.name}. Fix these lines and upload the file again.`, problems: error.problems });
      if (error instanceof UserError) return render(409, { error: error.message });
      throw error;
    }
  });

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
