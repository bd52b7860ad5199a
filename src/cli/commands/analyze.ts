import { readFileSync } from 'node:fs';
import { analyze } from '../../text/analyze.ts';
import { runAllChecks } from '../../checks/run-checks.ts';
import { UserError, errorCode } from '../../errors.ts';
import type { Command, CommandIo } from '../command.ts';

async function readInput(path: string | undefined, io: CommandIo): Promise<string> {
  if (path === undefined || path === '-') {
    const chunks: Buffer[] = [];
    for await (const chunk of io.stdin) chunks.push(Buffer.from(chunk as Buffer));
    return decodeUtf8(Buffer.concat(chunks), 'standard input');
  }
  try {
    return decodeUtf8(readFileSync(path), path);
  } catch (error) {
    if (error instanceof UserError) throw error;
    const code = errorCode(error);
    if (code === 'ENOENT') throw new UserError(`${path}: no such file — check the path`);
    if (code === 'EISDIR') throw new UserError(`${path}: is a folder — give a text file`);
    throw new UserError(`${path}: cannot read (${code ?? String(error)})`);
  }
}

function decodeUtf8(bytes: Buffer, name: string): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new UserError(`${name}: not valid UTF-8 text — convert it to UTF-8 first`);
  }
}

/** `plumbline analyze`: every check's metrics and findings for one text, with default parameters. */
export const analyzeCommand: Command = {
  name: 'analyze',
  summary: 'run every check on one text and print metrics and findings',
  usage: 'plumbline analyze [FILE|-] [--prompt TEXT] [--json]',
  options: { values: ['prompt'], flags: ['json'], maxPositionals: 1 },
  async run(args, io) {
    const text = await readInput(args.positionals[0], io);
    const prompt = args.values.prompt !== undefined ? analyze(args.values.prompt) : undefined;
    const doc = analyze(text, { prompt });
    const results = runAllChecks(doc);
    if (args.flags.has('json')) {
      const checks = Object.fromEntries(
        Object.entries(results).map(([id, r]) => [id, { value: round(r.value), metrics: r.metrics, undefined_metrics: r.undefinedMetrics, findings: r.findings }]),
      );
      io.out(JSON.stringify({ characters: text.length, readability: results.readability.metrics, checks }, null, 2));
      return 0;
    }
    io.out(`${text.length} characters, ${doc.sentences.length} sentences${prompt ? '' : ' (no prompt given: prompt-aware checks are partial)'}`);
    for (const [id, r] of Object.entries(results)) {
      io.out('');
      io.out(`${id}  value ${round(r.value)}${r.findings.length ? `  ${r.findings.length} finding(s)` : ''}`);
      const metrics = Object.entries(r.metrics).map(([k, v]) => `${k}=${typeof v === 'number' ? round(v) : v ?? 'n/a'}`);
      if (metrics.length) io.out(`  ${metrics.join('  ')}`);
      for (const f of r.findings) io.out(`  ${f.start}-${f.end}  ${f.text}${f.evidence ? `  «${oneLine(f.evidence)}»` : ''}`);
    }
    io.out('');
    io.out('Findings are triage aids, not verdicts: a person decides.');
    return 0;
  },
};

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

function oneLine(text: string): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return flat.length > 90 ? `${flat.slice(0, 89)}…` : flat;
}
