/**
 * Runs one area's benchmark and writes its rows as JSON to the file named on the command line:
 * `run.ts` starts one process per area, so that no area's heap, threads or compiled code weigh
 * on the next one's figures.
 */
import { writeFileSync } from 'node:fs';
import { rubricBench } from './rubric.bench.ts';
import { statsBench } from './stats.bench.ts';
import { textAnalysisBench } from './text-analysis.bench.ts';
import { workflowBench } from './workflow.bench.ts';
import type { BenchRow } from './report.ts';

export const AREAS: Record<string, (options: { quick: boolean }) => Promise<BenchRow[]>> = {
  rubric: rubricBench,
  stats: statsBench,
  analysis: textAnalysisBench,
  workflow: workflowBench,
};

// the arguments after this file's path (it runs under run-ts.mjs)
const args = process.argv.slice(process.argv.findIndex((a) => a.endsWith('run-one.ts')) + 1);
const [area, out] = args.filter((a) => !a.startsWith('--'));
if (area) {
  const bench = AREAS[area];
  if (!bench) throw new Error(`no benchmark area "${area}"; the areas are ${Object.keys(AREAS).join(', ')}`);
  writeFileSync(out, JSON.stringify(await bench({ quick: process.argv.includes('--quick') })));
}
