import { cpus, totalmem } from 'node:os';

/** One line of the benchmark report. */
export interface BenchRow {
  area: string;
  name: string;
  value: number;
  unit: string;
  /** Ours divided by the reference (higher is better for throughput). */
  ratio?: number;
  target?: string;
  pass?: boolean;
  detail?: string;
}

function format(n: number): string {
  return Math.abs(n) >= 100 ? Math.round(n).toLocaleString('en') : n.toFixed(2);
}

/** Prints the rows as one Markdown table, with the machine's cores and memory. */
export function printReport(rows: BenchRow[]): string {
  const lines = [
    `Machine: ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown'}), ${(totalmem() / 1024 ** 3).toFixed(0)} GiB; Node ${process.version}; ${new Date().toISOString().slice(0, 16)}Z`,
    '',
    '| area | measure | figure | ratio | target | met |',
    '|---|---|---|---|---|---|',
    ...rows.map((r) => `| ${r.area} | ${r.name} | ${format(r.value)} ${r.unit} | ${r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}×`} | ${r.target ?? ''} | ${r.pass === undefined ? '' : r.pass ? 'yes' : 'NO'} |`),
  ];
  const details = rows.filter((r) => r.detail).map((r) => `- ${r.name}: ${r.detail}`);
  if (details.length) lines.push('', ...details);
  return lines.join('\n');
}
