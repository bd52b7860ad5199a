import { createReadStream } from 'node:fs';
import { Readable } from 'node:stream';
import { itemProblems, type BatchItem, type LineProblem } from './batch-format.ts';
import { parseCsvRecords } from './csv.ts';
import { utf8Lines } from './utf8-lines.ts';

export type BatchEvent = { kind: 'item'; item: BatchItem } | { kind: 'problems'; problems: LineProblem[] };

export interface ReadOptions {
  format?: 'jsonl' | 'csv';
  maxTextBytes?: number;
}

/** Picks the format from the file name, or from the first character of the content. */
export function formatOf(name: string, firstChar: string | undefined): 'jsonl' | 'csv' {
  if (/\.(jsonl|ndjson|json)$/i.test(name)) return 'jsonl';
  if (/\.csv$/i.test(name)) return 'csv';
  return firstChar === '{' ? 'jsonl' : 'csv';
}

const str = (v: unknown) => (typeof v === 'string' ? v : undefined);

function jsonlItem(value: unknown, line: number): { item?: BatchItem; problems: LineProblem[] } {
  const problems: LineProblem[] = [];
  const at = (field: string | null, message: string) => problems.push({ line, field, message });
  if (!value || typeof value !== 'object' || Array.isArray(value)) {
    at(null, 'must be a JSON object {"prompt_id", "prompt", "responses": [...]}');
    return { problems };
  }
  const o = value as Record<string, unknown>;
  for (const key of Object.keys(o)) if (!['prompt_id', 'prompt', 'responses', 'flag', 'meta'].includes(key)) at(key, 'is not a field of the import format (prompt_id, prompt, responses, flag, meta)');
  const promptId = typeof o.prompt_id === 'number' ? String(o.prompt_id) : str(o.prompt_id);
  if (promptId === undefined) at('prompt_id', o.prompt_id === undefined ? 'is missing' : 'must be text');
  if (str(o.prompt) === undefined) at('prompt', o.prompt === undefined ? 'is missing' : 'must be text');
  const responses: BatchItem['responses'] = [];
  if (!Array.isArray(o.responses)) at('responses', o.responses === undefined ? 'is missing' : 'must be a list of {"response_id", "text"}');
  else {
    o.responses.forEach((r, i) => {
      const field = `responses[${i + 1}]`;
      if (!r || typeof r !== 'object') return at(field, 'must be an object {"response_id", "text"}');
      const rr = r as Record<string, unknown>;
      const id = typeof rr.response_id === 'number' ? String(rr.response_id) : str(rr.response_id);
      if (id === undefined) at(`${field}.response_id`, rr.response_id === undefined ? 'is missing' : 'must be text');
      if (str(rr.text) === undefined) at(`${field}.text`, rr.text === undefined ? 'is missing' : 'must be text');
      if (id !== undefined && str(rr.text) !== undefined) responses.push({ responseId: id, text: rr.text as string });
    });
  }
  let flag: BatchItem['flag'] = null;
  if (o.flag !== undefined && o.flag !== null) {
    const f = o.flag as Record<string, unknown>;
    if (typeof o.flag !== 'object' || str(f.reason) === undefined || str(f.severity) === undefined) at('flag', 'must be {"reason": text, "severity": low|medium|high|critical}');
    else flag = { reason: f.reason as string, severity: f.severity as string };
  }
  if (o.meta !== undefined && o.meta !== null && (typeof o.meta !== 'object' || Array.isArray(o.meta))) at('meta', 'must be an object');
  if (problems.length) return { problems };
  const item: BatchItem = { promptId: promptId!, prompt: o.prompt as string, responses, flag, meta: (o.meta as Record<string, unknown>) ?? null, line };
  return { item, problems: [] };
}

async function* readJsonl(input: Readable, options: ReadOptions): AsyncGenerator<BatchEvent> {
  const ids = new Map<string, number>();
  for await (const entry of utf8Lines(input)) {
    if ('error' in entry) {
      yield { kind: 'problems', problems: [{ line: entry.line, field: null, message: entry.error }] };
      return;
    }
    if (!entry.text.trim()) continue;
    let value: unknown;
    try {
      value = JSON.parse(entry.text.replace(/^\uFEFF/, ''));
    } catch (error) {
      const reason = error instanceof Error ? error.message.replace(/^(Unexpected|Expected)/, (m) => m.toLowerCase()) : String(error);
      yield { kind: 'problems', problems: [{ line: entry.line, field: null, message: `is not valid JSON (${reason}) — each line must hold one JSON object` }] };
      continue;
    }
    const { item, problems } = jsonlItem(value, entry.line);
    const all = item ? itemProblems(item, options.maxTextBytes) : problems;
    if (item && ids.has(item.promptId)) all.push({ line: entry.line, field: 'prompt_id', message: `"${item.promptId}" was already used on line ${ids.get(item.promptId)} — prompt ids must be unique in a file` });
    if (all.length) yield { kind: 'problems', problems: all };
    else {
      ids.set(item!.promptId, entry.line);
      yield { kind: 'item', item: item! };
    }
  }
}

const CSV_REQUIRED = ['prompt_id', 'prompt', 'response_id', 'response'];
const CSV_OPTIONAL = ['flag_reason', 'flag_severity'];

async function* readCsv(input: Readable, options: ReadOptions): AsyncGenerator<BatchEvent> {
  let header: string[] | null = null;
  let current: BatchItem | null = null;
  const finished = new Map<string, number>();
  const finish = (item: BatchItem): BatchEvent => {
    const problems = itemProblems(item, options.maxTextBytes);
    finished.set(item.promptId, item.line);
    return problems.length ? { kind: 'problems', problems } : { kind: 'item', item };
  };
  for await (const record of parseCsvRecords(utf8Lines(input))) {
    if ('error' in record) {
      yield { kind: 'problems', problems: [{ line: record.line, field: null, message: record.error }] };
      if (record.fatal) return;
      continue;
    }
    if (!header) {
      header = record.fields.map((f) => f.trim().replace(/^\uFEFF/, ''));
      const missing = CSV_REQUIRED.filter((c) => !header!.includes(c));
      const unknown = header.filter((c) => !CSV_REQUIRED.includes(c) && !CSV_OPTIONAL.includes(c));
      if (missing.length || unknown.length) {
        yield { kind: 'problems', problems: [{ line: record.line, field: 'header', message: `${missing.length ? `lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}` : ''}${missing.length && unknown.length ? ' and ' : ''}${unknown.length ? `has unknown column${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')}` : ''} — the header must be ${CSV_REQUIRED.join(',')} (optional: ${CSV_OPTIONAL.join(',')})` }] };
        return;
      }
      continue;
    }
    if (record.fields.length === 1 && record.fields[0] === '') continue;
    if (record.fields.length !== header.length) {
      yield { kind: 'problems', problems: [{ line: record.line, field: null, message: `has ${record.fields.length} fields; the header has ${header.length} — quote fields that contain commas` }] };
      continue;
    }
    const row = Object.fromEntries(header.map((h, i) => [h, record.fields[i]]));
    if (current && current.promptId !== row.prompt_id) {
      yield finish(current);
      current = null;
    }
    if (!current) {
      if (finished.has(row.prompt_id)) {
        yield { kind: 'problems', problems: [{ line: record.line, field: 'prompt_id', message: `"${row.prompt_id}" appears again after other prompts (first at line ${finished.get(row.prompt_id)}) — keep each prompt's rows together` }] };
        continue;
      }
      const flag = row.flag_severity || row.flag_reason ? { reason: row.flag_reason ?? '', severity: row.flag_severity ?? '' } : null;
      current = { promptId: row.prompt_id, prompt: row.prompt, responses: [], flag, meta: null, line: record.line };
    } else if (row.prompt !== current.prompt) {
      yield { kind: 'problems', problems: [{ line: record.line, field: 'prompt', message: `differs from the prompt given for "${current.promptId}" on line ${current.line} — every row of a prompt must repeat it exactly` }] };
      continue;
    }
    current.responses.push({ responseId: row.response_id, text: row.response });
  }
  if (current) yield finish(current);
  if (!header) yield { kind: 'problems', problems: [{ line: 1, field: 'header', message: `the file is empty — a CSV import starts with the header ${CSV_REQUIRED.join(',')}` }] };
}

/**
 * Reads a batch file item by item, in flat memory: JSONL (one prompt with its responses per
 * line) or CSV (one response per row, a prompt's rows together). Bad lines come as `problems`
 * events with line, field and reason; reading goes on so every bad line is reported.
 */
export async function* readBatch(input: Readable, name: string, options: ReadOptions = {}): AsyncGenerator<BatchEvent> {
  const [first, rest] = await peek(input);
  const format = options.format ?? formatOf(name, first);
  yield* format === 'jsonl' ? readJsonl(rest, options) : readCsv(rest, options);
}

/** The first non-space character of a stream, and the stream again from its start. */
async function peek(input: Readable): Promise<[string | undefined, Readable]> {
  const iterator = input[Symbol.asyncIterator]();
  const head: Buffer[] = [];
  let first: string | undefined;
  while (first === undefined) {
    const { value, done } = await iterator.next();
    if (done) break;
    head.push(value as Buffer);
    first = Buffer.concat(head).toString('utf8').replace(/^\uFEFF/, '').trimStart()[0];
  }
  async function* replay() {
    yield* head;
    while (true) {
      const { value, done } = await iterator.next();
      if (done) return;
      yield value as Buffer;
    }
  }
  return [first, Readable.from(replay())];
}

/** Opens a file (or standard input for "-") for `readBatch`. */
export function openBatchInput(path: string): Readable {
  return path === '-' ? process.stdin : createReadStream(path);
}

