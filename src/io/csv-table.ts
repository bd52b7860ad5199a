import { createReadStream } from 'node:fs';
import { UserError, errorCode } from '../errors.ts';
import { parseCsvRecords } from './csv.ts';
import { utf8Lines } from './utf8-lines.ts';

export interface CsvRow {
  line: number;
  values: Record<string, string>;
}

/**
 * Reads a small CSV table whose header must hold `columns` (others are refused). Any bad row is
 * a `UserError` naming file and line.
 */
export async function readCsvTable(path: string, columns: string[]): Promise<CsvRow[]> {
  const stream = createReadStream(path);
  const rows: CsvRow[] = [];
  let header: string[] | null = null;
  try {
    for await (const record of parseCsvRecords(utf8Lines(stream))) {
      if ('error' in record) throw new UserError(`${path}:${record.line}: ${record.error}`);
      if (!header) {
        header = record.fields.map((f) => f.trim().replace(/^\uFEFF/, ''));
        const missing = columns.filter((c) => !header!.includes(c));
        if (missing.length) throw new UserError(`${path}:1: the header lacks ${missing.join(', ')} — it must be ${columns.join(',')}`);
        continue;
      }
      if (record.fields.length === 1 && record.fields[0] === '') continue;
      if (record.fields.length !== header.length) throw new UserError(`${path}:${record.line}: has ${record.fields.length} fields; the header has ${header.length}`);
      rows.push({ line: record.line, values: Object.fromEntries(header.map((h, i) => [h, record.fields[i].trim()])) });
    }
  } catch (error) {
    if (error instanceof UserError) throw error;
    const code = errorCode(error);
    throw new UserError(code === 'ENOENT' ? `${path}: no such file — check the path` : `${path}: cannot read (${code ?? String(error)})`);
  }
  if (!header) throw new UserError(`${path}: the file is empty — it must start with the header ${columns.join(',')}`);
  return rows;
}
