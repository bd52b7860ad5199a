/**
 * Runs one area's benchmark and writes its rows as JSON to the file named on the command line:
 * `run.ts` starts one process per area, so that no area's heap, threads or compiled code weigh
 * on the next one's figures. Only that area's module is loaded.
 */
import { writeFileSync } from 'node:fs';
import type { BenchRow } from './report.ts';

type Bench = (options: { quick: boolean }) => Promise<BenchRow[]>;

export const AREAS: Record<string, () => Promise<Bench>> = {
  rubric: async () => (await import('./rubric.bench.ts')).rubricBench,
  stats: async () => (await import('./stats.bench.ts')).statsBench,
  analysis: async () => (await import('./text-analysis.bench.ts')).textAnalysisBench,
  workflow: async () => (await import('./workflow.bench.ts')).workflowBench,
};

// the arguments after this file's path (it runs under run-ts.mjs)
const args = process.argv.slice(process.argv.findIndex((a) => a.endsWith('run-one.ts')) + 1);
const [area, out] = args.filter((a) => !a.startsWith('--'));
if (area) {
  const load = AREAS[area];
  if (!load) throw new Error(`no benchmark area "${area}"; the areas are ${Object.keys(AREAS).join(', ')}`);
  const bench = await load();
  writeFileSync(out, JSON.stringify(await bench({ quick: process.argv.includes('--quick') })));
}
