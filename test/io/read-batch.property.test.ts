import { Readable } from 'node:stream';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readBatch, type BatchEvent } from '../../src/io/read-batch.ts';

/** Text with what breaks parsers: quotes, commas, line breaks, emoji, accents, right-to-left script. */
const text = fc
  .array(fc.oneof(fc.string({ unit: 'grapheme', maxLength: 10 }), fc.constantFrom('"', ',', '\n', '\r\n', '""', '😀', 'é', 'שלום', '\t', ' ', 'a,b', '"quoted"')), { minLength: 1, maxLength: 12 })
  .map((parts) => parts.join(''))
  .filter((t) => t.trim().length > 0);
const id = fc.string({ unit: 'grapheme-ascii', minLength: 1, maxLength: 8 }).filter((s) => s.trim() === s && s.length > 0 && !/[\r\n]/.test(s));

const items = fc.uniqueArray(
  fc.record({
    promptId: id,
    prompt: text,
    responses: fc.uniqueArray(fc.record({ responseId: id, text }), { minLength: 2, maxLength: 9, selector: (r) => r.responseId }),
  }),
  { minLength: 1, maxLength: 8, selector: (i) => i.promptId },
);

/** The bytes cut at arbitrary places (inside characters too), as a network or disk delivers them. */
function chunked(bytes: Buffer, cuts: number[]): Readable {
  const points = [...new Set(cuts.map((c) => c % (bytes.length + 1)))].sort((a, b) => a - b);
  const parts: Buffer[] = [];
  let last = 0;
  for (const p of points) {
    parts.push(bytes.subarray(last, p));
    last = p;
  }
  parts.push(bytes.subarray(last));
  return Readable.from(parts.filter((p) => p.length));
}

async function read(input: Readable, name: string): Promise<BatchEvent[]> {
  const events: BatchEvent[] = [];
  for await (const event of readBatch(input, name)) events.push(event);
  return events;
}

const csvField = (value: string) => (/[",\r\n]/.test(value) || value !== value.trim() ? `"${value.replace(/"/g, '""')}"` : value);

describe('the import parser under generated input (fast-check)', () => {
  it('reads back exactly the items written as JSON Lines, however the bytes are cut', async () => {
    await fc.assert(
      fc.asyncProperty(items, fc.array(fc.nat(), { maxLength: 6 }), async (generated, cuts) => {
        const file = generated.map((i) => JSON.stringify({ prompt_id: i.promptId, prompt: i.prompt, responses: i.responses.map((r) => ({ response_id: r.responseId, text: r.text })) })).join('\n');
        const events = await read(chunked(Buffer.from(file), cuts), 'batch.jsonl');
        expect(events.filter((e) => e.kind === 'problems')).toEqual([]);
        expect(events.map((e) => (e.kind === 'item' ? { promptId: e.item.promptId, prompt: e.item.prompt, responses: e.item.responses } : null))).toEqual(generated);
      }),
      { numRuns: 150 },
    );
  });

  it('reads back exactly the items written as CSV (quoted fields with commas, quotes and line breaks)', async () => {
    await fc.assert(
      fc.asyncProperty(items, fc.array(fc.nat(), { maxLength: 6 }), async (generated, cuts) => {
        const rows = ['prompt_id,prompt,response_id,response', ...generated.flatMap((i) => i.responses.map((r) => [i.promptId, i.prompt, r.responseId, r.text].map(csvField).join(',')))];
        const events = await read(chunked(Buffer.from(rows.join('\r\n')), cuts), 'batch.csv');
        expect(events.filter((e) => e.kind === 'problems')).toEqual([]);
        expect(events.map((e) => (e.kind === 'item' ? { promptId: e.item.promptId, prompt: e.item.prompt, responses: e.item.responses } : null))).toEqual(generated);
      }),
      { numRuns: 150 },
    );
  });

  it('never throws on arbitrary bytes, and every problem names a line of the file', async () => {
    const junk = fc.oneof(
      fc.uint8Array({ maxLength: 400 }).map((a) => Buffer.from(a)),
      fc.array(fc.oneof(fc.string({ maxLength: 40 }), fc.constantFrom('{"prompt_id":', '"responses": [', 'prompt_id,prompt,response_id,response', '"', ',,,', '\uFEFF', '\u0000')), { maxLength: 20 }).map((lines) => Buffer.from(lines.join('\n'))),
    );
    await fc.assert(
      fc.asyncProperty(junk, fc.constantFrom('x.jsonl', 'x.csv'), async (bytes, name) => {
        const events = await read(Readable.from([bytes]), name);
        const lines = bytes.toString('utf8').split('\n').length;
        for (const e of events) {
          if (e.kind !== 'problems') continue;
          for (const p of e.problems) {
            expect(p.line).toBeGreaterThanOrEqual(1);
            expect(p.line).toBeLessThanOrEqual(lines);
            expect(p.message.length).toBeGreaterThan(0);
          }
        }
      }),
      { numRuns: 300 },
    );
  });
});
