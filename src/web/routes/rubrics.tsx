/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { HttpError } from '../../errors.ts';
import { compareRubrics, loadBatchItems } from '../../rubric/impact.ts';
import { lineDiff } from '../../rubric/line-diff.ts';
import { loadRubric } from '../../rubric/load.ts';
import { listBatches } from '../../store/repos/batches.ts';
import { currentRubric, listRubrics, listVersions, publishRubric, versionContent } from '../../store/repos/rubrics.ts';
import { RubricListPage } from '../../../views/rubrics/rubric-list-page.tsx';
import { RubricPage } from '../../../views/rubrics/rubric-page.tsx';
import { RubricDiffPage } from '../../../views/rubrics/rubric-diff-page.tsx';
import { ImpactReport, ProblemList, RubricEditorPage } from '../../../views/rubrics/rubric-editor-page.tsx';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

const READERS = ['policy', 'admin', 'data', 'adjudicator'] as const;
/** The largest rubric file accepted from the editor or an upload. */
const MAX_RUBRIC_BYTES = 256 * 1024;

async function formText(c: { req: { parseBody(): Promise<Record<string, unknown>> } }, field: string): Promise<string> {
  const body = await c.req.parseBody();
  const value = body[field];
  if (value instanceof File) return decode(await value.arrayBuffer());
  if (typeof value !== 'string') throw new HttpError(400, `The form has no "${field}". Reload the editor and try again.`);
  if (value.length > MAX_RUBRIC_BYTES) throw new HttpError(413, `The rubric is over ${MAX_RUBRIC_BYTES / 1024} KB. Split its term lists or shorten it.`);
  return value;
}

function decode(bytes: ArrayBuffer): string {
  if (bytes.byteLength > MAX_RUBRIC_BYTES) throw new HttpError(413, `The file is over ${MAX_RUBRIC_BYTES / 1024} KB. Split its term lists or shorten it.`);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new HttpError(415, 'The file is not UTF-8 text. Save it as UTF-8 and load it again.');
  }
}

/** Rubric list, detail with history and diffs, and the policy owner's editor, preview and publish. */
export function rubricRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/rubrics', requireRole(...READERS), async (c) => {
    return c.html(<RubricListPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubrics={await listRubrics(c.get('store').db)} />);
  });

  app.get('/rubrics/:id{[a-z0-9][a-z0-9-]*}', requireRole(...READERS), async (c) => {
    const { db } = c.get('store');
    const id = c.req.param('id');
    const rubric = await currentRubric(db, id);
    if (!rubric) throw new HttpError(404, `There is no rubric "${id}". Pick one from the rubric list.`);
    return c.html(<RubricPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubric={rubric} versions={await listVersions(db, id)} />);
  });

  app.get('/rubrics/:id{[a-z0-9][a-z0-9-]*}/diff', requireRole(...READERS), async (c) => {
    const { db } = c.get('store');
    const id = c.req.param('id');
    const from = c.req.query('from') ?? '';
    const to = c.req.query('to') ?? '';
    const [a, b] = await Promise.all([versionContent(db, id, from), versionContent(db, id, to)]);
    if (a === undefined || b === undefined) throw new HttpError(404, `Version "${a === undefined ? from : to}" of "${id}" is not published. Pick two versions from the history.`);
    return c.html(<RubricDiffPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={id} from={from} to={to} lines={lineDiff(a, b)} />);
  });

  app.get('/rubrics/:id{[a-z0-9][a-z0-9-]*}/edit', requireRole('policy'), async (c) => {
    const { db } = c.get('store');
    const id = c.req.param('id');
    const rubric = await currentRubric(db, id);
    if (!rubric) throw new HttpError(404, `There is no rubric "${id}" to edit.`);
    return c.html(<RubricEditorPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={id} source={rubric.source} problems={[]} version={rubric.version} batches={await listBatches(db)} />);
  });

  app.post('/rubrics/:id{[a-z0-9][a-z0-9-]*}/upload', requireRole('policy'), async (c) => {
    const source = await formText(c, 'file');
    const { problems, rubric } = loadRubric(source);
    return c.html(<RubricEditorPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={c.req.param('id')} source={source} problems={problems} version={rubric?.version} batches={await listBatches(c.get('store').db)} />);
  });

  app.post('/rubrics/:id{[a-z0-9][a-z0-9-]*}/draft', requireRole('policy'), async (c) => {
    const source = await formText(c, 'source');
    const { problems, rubric } = loadRubric(source);
    return c.html(<RubricEditorPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={c.req.param('id')} source={source} problems={problems} version={rubric?.version} batches={await listBatches(c.get('store').db)} />);
  });

  app.post('/rubrics/validate', requireRole('policy'), async (c) => {
    const { problems, rubric } = loadRubric(await formText(c, 'source'));
    return c.html(<ProblemList problems={problems} version={rubric?.version} />);
  });

  app.post('/rubrics/:id{[a-z0-9][a-z0-9-]*}/preview', requireRole('policy'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody();
    const source = typeof body.source === 'string' ? body.source : '';
    const { problems, rubric: draft } = loadRubric(source);
    if (!draft) return c.html(<ProblemList problems={problems} />, 422);
    const current = await currentRubric(db, c.req.param('id'));
    if (!current) throw new HttpError(404, `There is no rubric "${c.req.param('id')}".`);
    const batchId = Number(body.batch);
    const batch = await db.selectFrom('batches').select(['id', 'name']).where('id', '=', Number.isInteger(batchId) ? batchId : -1).executeTakeFirst();
    if (!batch) throw new HttpError(422, 'Pick a batch to preview the draft on.');
    const impact = compareRubrics(current, draft, await loadBatchItems(db, batch.id, current));
    return c.html(<ImpactReport impact={impact} batchName={batch.name} />);
  });

  app.post('/rubrics/:id{[a-z0-9][a-z0-9-]*}/publish', requireRole('policy'), async (c) => {
    const { db } = c.get('store');
    const id = c.req.param('id');
    const body = await c.req.parseBody();
    const source = typeof body.source === 'string' ? body.source : '';
    const note = typeof body.note === 'string' && body.note.trim() ? body.note.trim().slice(0, 500) : null;
    const { problems, rubric } = loadRubric(source);
    const editor = async (status: 422 | 409, error: string) =>
      c.html(<RubricEditorPage user={c.get('user')!} csrfToken={c.get('csrfToken')} rubricId={id} source={source} problems={problems} batches={await listBatches(db)} error={error} />, status);
    if (!rubric) return editor(422, `Not published: the draft has ${problems.length} problem(s). The version in force is unchanged.`);
    try {
      await publishRubric(db, id, rubric, c.get('user')!.id, note);
    } catch (error) {
      if (error instanceof HttpError && (error.status === 409 || error.status === 422)) return editor(error.status, `Not published: ${error.message}`);
      throw error;
    }
    return c.redirect(`/rubrics/${id}`, 303);
  });

  return app;
}
