import { formatProblem, loadRubricFile } from '../../rubric/load.ts';
import { runExamples } from '../../rubric/run-examples.ts';
import { UsageError, UserError } from '../../errors.ts';
import { configFromEnv } from '../../config.ts';
import { compareRubrics, loadBatchItems } from '../../rubric/impact.ts';
import { openStore } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import { findBatchByName } from '../../store/repos/batches.ts';
import type { Command } from '../command.ts';

/** `plumbline rubric check FILE…`: every problem as file:line:column: message. */
export const rubricCheckCommand: Command = {
  name: 'rubric check',
  summary: 'validate rubric files and list every problem as file:line:column: message',
  usage: 'plumbline rubric check FILE…',
  options: { maxPositionals: 1000 },
  async run(args, io) {
    if (!args.positionals.length) throw new UsageError('plumbline rubric check: name at least one rubric file');
    let problems = 0;
    for (const path of args.positionals) {
      const result = loadRubricFile(path);
      for (const p of result.problems) io.out(formatProblem(path, p));
      problems += result.problems.length;
      if (result.rubric) io.out(`${path}: ok — rubric "${result.rubric.id}" version ${result.rubric.version}, ${result.rubric.criteria.length} criteria, ${result.rubric.examples.length} examples`);
    }
    if (problems) io.err(`${problems} problem${problems === 1 ? '' : 's'} found`);
    return problems ? 1 : 0;
  },
};

/** `plumbline rubric test FILE…`: runs each rubric's examples like unit tests. */
export const rubricTestCommand: Command = {
  name: 'rubric test',
  summary: 'run the examples in rubric files and report like a test runner',
  usage: 'plumbline rubric test FILE…',
  options: { maxPositionals: 1000 },
  async run(args, io) {
    if (!args.positionals.length) throw new UsageError('plumbline rubric test: name at least one rubric file');
    let passed = 0;
    let failed = 0;
    for (const path of args.positionals) {
      const result = loadRubricFile(path);
      if (!result.rubric) {
        for (const p of result.problems) io.out(formatProblem(path, p));
        io.out(`${path}: not run — fix the problems above first (plumbline rubric check)`);
        failed++;
        continue;
      }
      io.out(`${path} (${result.rubric.id} ${result.rubric.version})`);
      for (const { example, failures } of runExamples(result.rubric)) {
        if (failures.length) {
          failed++;
          io.out(`  ✗ ${example.name}`);
          for (const f of failures) io.out(`      ${f}`);
        } else {
          passed++;
          io.out(`  ✓ ${example.name}`);
        }
      }
    }
    io.out(`${passed} passed, ${failed} failed`);
    return failed ? 1 : 0;
  },
};

/** `plumbline rubric diff OLD NEW --batch NAME`: what NEW would change on a stored batch. */
export const rubricDiffCommand: Command = {
  name: 'rubric diff',
  summary: 'preview what a changed rubric would do to a stored batch',
  usage: 'plumbline rubric diff OLD.yaml NEW.yaml --batch NAME [--json]',
  options: { values: ['batch'], flags: ['json'], maxPositionals: 2 },
  async run(args, io) {
    const [oldPath, newPath] = args.positionals;
    if (!oldPath || !newPath) throw new UsageError('plumbline rubric diff: name the old and the new rubric file');
    const batchName = args.values.batch;
    if (!batchName) throw new UsageError('plumbline rubric diff: say which stored batch to re-score with --batch NAME');
    const rubrics = [loadRubricFile(oldPath), loadRubricFile(newPath)];
    for (const r of rubrics) for (const p of r.problems) io.err(formatProblem(r.path, p));
    if (!rubrics[0].rubric || !rubrics[1].rubric) throw new UserError('fix the rubric problems above (plumbline rubric check) and compare again');
    const store = await openStore(configFromEnv(io.env).database);
    try {
      await migrate(store);
      const batch = await findBatchByName(store.db, batchName);
      if (!batch) throw new UserError(`there is no batch "${batchName}" — plumbline lists batches on the Batches page`);
      const impact = compareRubrics(rubrics[0].rubric, rubrics[1].rubric, await loadBatchItems(store.db, batch.id));
      if (args.flags.has('json')) {
        io.out(JSON.stringify(impact, null, 2));
        return 0;
      }
      const pct = (x: number | null) => (x === null ? 'n/a' : `${(x * 100).toFixed(1)}%`);
      io.out(`${batchName}: ${impact.items} items, ${impact.responses} responses re-scored with ${rubrics[0].rubric.version} and ${rubrics[1].rubric.version}`);
      io.out(`agreement with final human rankings (${impact.humanAgreement.items} items): ${pct(impact.humanAgreement.before)} → ${pct(impact.humanAgreement.after)}`);
      io.out(`${impact.moves.length} items move in the queue${impact.moves.length ? '; most:' : ''}`);
      for (const m of impact.moves.slice(0, 10)) io.out(`  ${m.promptId}: ${m.before} → ${m.after}`);
      io.out(`${impact.bandChanges.length} candidates change band`);
      for (const b of impact.bandChanges.slice(0, 20)) io.out(`  ${b.promptId}/${b.responseId}: ${b.before} → ${b.after} (${b.scoreBefore} → ${b.scoreAfter})`);
      io.out(`${impact.orderChanges.length} suggested orders change`);
      for (const o of impact.orderChanges.slice(0, 10)) io.out(`  ${o.promptId}: ${o.before.join(' > ')}  →  ${o.after.join(' > ')}`);
      return 0;
    } finally {
      await store.close();
    }
  },
};
