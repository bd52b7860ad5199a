/**
 * `npm run bench`: every benchmark, one report. Figures are measured side by side in one run
 * and reported as ratios, since the machine is shared. `--quick` runs smaller sizes.
 * Benchmarks print figures; they never fail the run (`npm test` is for pass/fail).
 */
import { writeFileSync, mkdirSync } from 'node:fs';
import { rubricBench } from './rubric.bench.ts';
import { statsBench } from './stats.bench.ts';
import { textAnalysisBench } from './text-analysis.bench.ts';
import { workflowBench } from './workflow.bench.ts';
import { printReport, type BenchRow } from './report.ts';

const quick = process.argv.includes('--quick');
const rows: BenchRow[] = [];
for (const bench of [rubricBench, statsBench, textAnalysisBench, workflowBench]) rows.push(...(await bench({ quick })));
const report = printReport(rows);
console.log(report);
mkdirSync('bench-results', { recursive: true });
writeFileSync('bench-results/latest.md', `${report}\n`);
