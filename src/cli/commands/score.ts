import { createWriteStream, mkdtempSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { UserError } from '../../errors.ts';
import { openBatchInput, readBatch } from '../../io/read-batch.ts';
import { formatProblem, loadRubricFile } from '../../rubric/load.ts';
import { scoreItem } from '../../rubric/score.ts';
import type { Command, CommandIo } from '../command.ts';

export const DEFAULT_RUBRIC = fileURLToPath(new URL('../../../rubrics/general.yaml', import.meta.url));

/** A progress reporter on stderr: a bar on a terminal, a line every tenth otherwise. */
export function progress(io: CommandIo, total: number, label: string, unit = 'responses') {
  const tty = Boolean(process.stderr.isTTY);
  let lastTenth = 0;
  return {
    update(done: number) {
      if (total <= 1000) return;
      if (tty) {
        const width = 30;
        const filled = Math.round((done / total) * width);
        process.stderr.write(`\r${label} [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total}`);
        if (done === total) process.stderr.write('\n');
      } else {
        const tenth = Math.floor((done / total) * 10);
        if (tenth > lastTenth) {
          lastTenth = tenth;
          io.err(`${label}: ${done} of ${total} ${unit} (${tenth * 10}%)`);
        }
      }
    },
  };
}

/** Standard input is read twice (to validate, then to score), so it is saved to a temporary file first. */
async function materialise(path: string, io: CommandIo): Promise<{ path: string; cleanup: () => void }> {
  if (path !== '-') return { path, cleanup: () => {} };
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-score-'));
  const file = join(dir, 'stdin');
  const chunks: Buffer[] = [];
  for await (const chunk of io.stdin) chunks.push(Buffer.from(chunk as Buffer));
  writeFileSync(file, Buffer.concat(chunks));
  return { path: file, cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

/** `plumbline score FILE [--rubric R] [--out F]`: one JSON line per response. */
export const scoreCommand: Command = {
  name: 'score',
  summary: 'score a JSONL or CSV batch against a rubric; one JSON line per response',
  usage: 'plumbline score FILE|- [--rubric RUBRIC.yaml] [--out FILE] [--format jsonl|csv]',
  options: { values: ['rubric', 'out', 'format'], maxPositionals: 1 },
  async run(args, io) {
    const source = args.positionals[0];
    if (!source) throw new UserError('plumbline score: name the batch file to score (or - for standard input)');
    const format = args.values.format as 'jsonl' | 'csv' | undefined;
    if (format && format !== 'jsonl' && format !== 'csv') throw new UserError(`--format must be jsonl or csv, not "${format}"`);
    const rubricPath = args.values.rubric ?? DEFAULT_RUBRIC;
    const loaded = loadRubricFile(rubricPath);
    if (!loaded.rubric) {
      for (const p of loaded.problems) io.err(formatProblem(rubricPath, p));
      throw new UserError(`${rubricPath}: the rubric has ${loaded.problems.length} problem(s) — fix them (plumbline rubric check) and score again`);
    }
    const rubric = loaded.rubric;
    const input = await materialise(source, io);
    try {
      // pass 1: every bad line, before anything is written
      let problems = 0;
      let responses = 0;
      for await (const event of readBatch(openBatchInput(input.path), source, { format })) {
        if (event.kind === 'problems') {
          for (const p of event.problems) io.err(`${source}:${p.line}: ${p.field ? `${p.field}: ` : ''}${p.message}`);
          problems += event.problems.length;
        } else responses += event.item.responses.length;
      }
      if (problems) throw new UserError(`${source}: ${problems} problem(s) found — nothing was scored; fix the lines above and score again`);

      // pass 2: score, writing to a temporary file renamed into place at the end
      const outPath = args.values.out ? resolve(args.values.out) : null;
      const tmpPath = outPath ? join(dirname(outPath), `.${Date.now()}.plumbline-score.tmp`) : null;
      const out = tmpPath ? createWriteStream(tmpPath) : null;
      const write = (line: string) => (out ? out.write(`${line}\n`) : io.out(line));
      const bar = progress(io, responses, 'scoring');
      let done = 0;
      for await (const event of readBatch(openBatchInput(input.path), source, { format })) {
        if (event.kind !== 'item') continue;
        const { item } = event;
        const scored = scoreItem(rubric, { prompt: item.prompt, responses: item.responses, flagSeverity: item.flag?.severity ?? null });
        for (const r of scored.responses) {
          write(
            JSON.stringify({
              prompt_id: item.promptId,
              response_id: r.responseId,
              rubric: scored.rubric,
              score: r.score,
              band: r.band,
              suggested_rank: r.suggestedRank,
              criteria: r.criteria,
              findings: r.findings.map((f) => ({ criterion: f.criterion, check: f.check, start: f.start, end: f.end, severity: f.severity, message: f.message, message_id: f.messageId, evidence: f.evidence })),
              priority: scored.priority,
            }),
          );
        }
        done += item.responses.length;
        bar.update(done);
      }
      if (out && tmpPath && outPath) {
        await new Promise<void>((done, fail) => out.end((error?: Error | null) => (error ? fail(error) : done())));
        renameSync(tmpPath, outPath);
        io.err(`scored ${done} responses with ${rubric.id} ${rubric.version} → ${outPath}`);
      }
      return 0;
    } finally {
      input.cleanup();
    }
  },
};
