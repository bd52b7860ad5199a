import { createWriteStream, renameSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve, basename } from 'node:path';
import { configFromEnv } from '../../config.ts';
import { UsageError, UserError } from '../../errors.ts';
import { ExportTally, dataCard } from '../../io/data-card.ts';
import { decidedItems, pairsOf, rankingOf, type ExportOptions } from '../../io/export-decisions.ts';
import { openStore } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import { recordAudit } from '../../store/repos/audit.ts';
import { findBatchByName } from '../../store/repos/batches.ts';
import type { Command } from '../command.ts';

const PAIR_COLUMNS = ['batch', 'prompt_id', 'prompt', 'preferred_id', 'preferred_text', 'preferred_rank', 'other_id', 'other_text', 'other_rank', 'tie', 'decided_by', 'decided_at', 'reviewer_count', 'reviewer_ids', 'reviewer_agreement', 'rubric_id', 'rubric_version', 'rationale'];
const RANKING_COLUMNS = ['batch', 'prompt_id', 'prompt', 'response_id', 'text', 'rank', 'decided_by', 'decided_at', 'reviewer_count', 'reviewer_ids', 'reviewer_agreement', 'rubric_id', 'rubric_version', 'rationale'];

/** One CSV field, quoted when it must be (RFC 4180). Lists are joined with "; ". */
function csvField(value: unknown): string {
  const text = value === null || value === undefined ? '' : Array.isArray(value) ? value.join('; ') : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** `plumbline export`: final decisions as pairs or rankings, with a data card. */
export const exportCommand: Command = {
  name: 'export',
  summary: 'export final decisions as pairs or rankings (JSONL or CSV) with a data card',
  usage: 'plumbline export --format pairs|rankings --as jsonl|csv --out FILE [--batch NAME] [--since YYYY-MM-DD] [--include-ties] [--redact-pii]',
  options: { values: ['format', 'as', 'out', 'batch', 'since'], flags: ['include-ties', 'redact-pii'] },
  async run(args, io) {
    const format = args.values.format ?? 'pairs';
    const as = args.values.as ?? 'jsonl';
    if (format !== 'pairs' && format !== 'rankings') throw new UsageError(`plumbline export: --format must be pairs or rankings, not "${format}"`);
    if (as !== 'jsonl' && as !== 'csv') throw new UsageError(`plumbline export: --as must be jsonl or csv, not "${as}"`);
    if (!args.values.out) throw new UsageError('plumbline export: say where to write with --out FILE');
    const since = args.values.since;
    if (since && !/^\d{4}-\d{2}-\d{2}/.test(since) ) throw new UserError(`--since must be a date such as 2026-11-30, not "${since}"`);
    const options: ExportOptions = { format, batchName: args.values.batch, since, includeTies: args.flags.has('include-ties'), redactPii: args.flags.has('redact-pii') };
    const out = resolve(args.values.out);
    const tmp = join(dirname(out), `.${basename(out)}.${process.pid}.tmp`);
    const store = await openStore(configFromEnv(io.env).database);
    try {
      await migrate(store);
      if (options.batchName && !(await findBatchByName(store.db, options.batchName))) throw new UserError(`there is no batch "${options.batchName}"`);
      const stream = createWriteStream(tmp);
      const write = (text: string) => (stream.write(text) ? Promise.resolve() : new Promise<void>((done) => stream.once('drain', () => done())));
      const tally = new ExportTally();
      if (as === 'csv') await write(`${(format === 'pairs' ? PAIR_COLUMNS : RANKING_COLUMNS).join(',')}\n`);
      for await (const item of decidedItems(store.db, options)) {
        tally.addItem(item);
        if (format === 'pairs') {
          // one write per item, not per pair: fewer, larger chunks mean less stream bookkeeping per byte
          let lines = '';
          for (const pair of pairsOf(item, options.includeTies ?? false)) {
            tally.addPair(pair);
            lines += as === 'jsonl' ? `${JSON.stringify(pair)}\n` : `${PAIR_COLUMNS.map((c) => csvField(pair[c as keyof typeof pair])).join(',')}\n`;
          }
          if (lines) await write(lines);
        } else {
          const record = rankingOf(item);
          if (as === 'jsonl') await write(`${JSON.stringify(record)}\n`);
          else for (const r of record.responses) await write(`${RANKING_COLUMNS.map((c) => csvField(c === 'response_id' ? r.response_id : c === 'text' ? r.text : c === 'rank' ? r.rank : record[c as keyof typeof record])).join(',')}\n`);
        }
      }
      await new Promise<void>((done, fail) => stream.end((error?: Error | null) => (error ? fail(error) : done())));
      renameSync(tmp, out);
      const cardPath = out.replace(/\.(jsonl|csv)$/i, '') + '.card.md';
      writeFileSync(cardPath, dataCard(tally, { ...options, file: basename(out), as, createdAt: new Date().toISOString().slice(0, 16).replace('T', ' ') + ' UTC' }));
      await recordAudit(store.db, { actorId: null, kind: 'export', subject: options.batchName ? `batch:${options.batchName}` : 'all', detail: { format, as, items: tally.items, pairs: tally.pairs, redacted: options.redactPii, via: 'cli' } });
      io.out(`exported ${tally.items} decided items${format === 'pairs' ? ` as ${tally.pairs + (options.includeTies ? tally.tiedPairs : 0)} pairs` : ''} → ${out}`);
      io.out(`data card → ${cardPath}`);
      io.err('This file may hold harmful text and personal data: handle it under your data policy.');
      return 0;
    } finally {
      await store.close();
    }
  },
};
