import { formatProblem, loadRubricFile } from '../../rubric/load.ts';
import { runExamples } from '../../rubric/run-examples.ts';
import { UsageError } from '../../errors.ts';
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
