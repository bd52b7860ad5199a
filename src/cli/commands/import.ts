import { configFromEnv } from '../../config.ts';
import { UsageError, UserError } from '../../errors.ts';
import { importBatch, ImportRefused, type ImportProgress } from '../../io/import-batch.ts';
import { formatProblem, loadRubricFile } from '../../rubric/load.ts';
import { openStore } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import type { Command } from '../command.ts';
import { DEFAULT_RUBRIC, progress } from './score.ts';

/** `plumbline import FILE --batch NAME`: store a batch, scored, whole or not at all. */
export const importCommand: Command = {
  name: 'import',
  summary: 'import a JSONL or CSV batch into the database, scored with a rubric',
  usage: 'plumbline import FILE --batch NAME [--reviews N] [--rationale-min CHARS] [--rubric R.yaml] [--skip-invalid REJECTS.jsonl]',
  options: { values: ['batch', 'reviews', 'rationale-min', 'rubric', 'skip-invalid'], maxPositionals: 1 },
  async run(args, io) {
    const path = args.positionals[0];
    if (!path) throw new UsageError('plumbline import: name the file to import');
    const batchName = args.values.batch?.trim();
    if (!batchName) throw new UsageError('plumbline import: name the batch with --batch NAME');
    const reviews = args.values.reviews === undefined ? undefined : Number(args.values.reviews);
    if (reviews !== undefined && (!Number.isInteger(reviews) || reviews < 1 || reviews > 5)) throw new UserError(`--reviews must be a whole number from 1 to 5, not "${args.values.reviews}"`);
    const rationaleMin = args.values['rationale-min'] === undefined ? undefined : Number(args.values['rationale-min']);
    if (rationaleMin !== undefined && (!Number.isInteger(rationaleMin) || rationaleMin < 0 || rationaleMin > 2000)) throw new UserError(`--rationale-min must be a whole number of characters from 0 to 2000, not "${args.values['rationale-min']}"`);
    const rubricPath = args.values.rubric ?? DEFAULT_RUBRIC;
    const loaded = loadRubricFile(rubricPath);
    if (!loaded.rubric) {
      for (const p of loaded.problems) io.err(formatProblem(rubricPath, p));
      throw new UserError(`${rubricPath}: the rubric has ${loaded.problems.length} problem(s) — fix them (plumbline rubric check) and import again`);
    }
    const store = await openStore(configFromEnv(io.env).database);
    try {
      await migrate(store);
      let bar: ReturnType<typeof progress> | null = null;
      const onProgress = (p: ImportProgress) => {
        if (p.phase !== 'storing' || p.total === null) return;
        bar ??= progress(io, p.total, 'storing and scoring', 'prompts');
        bar.update(p.done);
      };
      const result = await importBatch(store, { path, batchName, rubric: loaded.rubric, reviews, rationaleMin, rejectsPath: args.values['skip-invalid'], onProgress });
      io.out(`imported "${batchName}": ${result.items} prompts, ${result.responses} responses, scored with ${loaded.rubric.id} ${loaded.rubric.version}${result.rejected ? `; ${result.rejected} problem(s) skipped, listed in ${args.values['skip-invalid']}` : ''}`);
      return 0;
    } catch (error) {
      if (error instanceof ImportRefused) for (const p of error.problems) io.err(`${path}:${p.line}: ${p.field ? `${p.field}: ` : ''}${p.message}`);
      throw error;
    } finally {
      await store.close();
    }
  },
};
