/**
 * `npm run bench`: every benchmark, one report. Figures are measured side by side in one run
 * and reported as ratios, since the machine is shared. `--quick` runs smaller sizes; an area's
 * name (`rubric`, `stats`, `analysis`, `workflow`) runs that area alone. Each area runs in a
 * process of its own. Benchmarks print figures; they never fail the run (`npm test` is for
 * pass/fail).
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { printReport, type BenchRow } from './report.ts';

const AREA_NAMES = ['rubric', 'stats', 'analysis', 'workflow'];
const quick = process.argv.includes('--quick');
const chosen = process.argv.slice(2).filter((a) => AREA_NAMES.includes(a));
const scratch = mkdtempSync(join(tmpdir(), 'plumbline-bench-'));
const here = (file: string) => fileURLToPath(new URL(file, import.meta.url));
const rows: BenchRow[] = [];
try {
  for (const area of chosen.length ? chosen : AREA_NAMES) {
    const out = join(scratch, `${area}.json`);
    const run = spawnSync(process.execPath, [here('./run-ts.mjs'), here('./run-one.ts'), area, out, ...(quick ? ['--quick'] : [])], { stdio: 'inherit' });
    if (run.status !== 0) throw new Error(`the ${area} benchmark failed (exit ${run.status}); its output is above`);
    rows.push(...(JSON.parse(readFileSync(out, 'utf8')) as BenchRow[]));
  }
} finally {
  rmSync(scratch, { recursive: true, force: true });
}
const report = printReport(rows);
console.log(report);
mkdirSync('bench-results', { recursive: true });
writeFileSync('bench-results/latest.md', `${report}\n`);
