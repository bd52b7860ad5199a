import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyze } from '../../src/text/analyze.ts';
import { runAllChecks } from '../../src/checks/run-checks.ts';

// Pieces that stress offsets: emoji (surrogate pairs, ZWJ sequences), accents (composed and
// combining), CJK, right-to-left script, CRLF and tabs, plus words that trigger many checks.
const pieces = [
  'Boil it for 1 minute.', 'Boil it for 10 minutes.', 'Never mix fuels.', 'It is not safe.', 'It is safe.', '😀', '👩‍👩‍👧', 'café', 'cafe\u0301',
  '水を沸騰させる。', 'مرحبا بالعالم', 'שלום', '\r\n', '\t', '  ', 'I cannot help with that.', 'Studies show this is 100% guaranteed.',
  'Call +44 7700 900123.', '4111 1111 1111 1111', 'a.b@example.org', 'GB82 WEST 1234 5698 7654 32', 'http://example.com/xxx',
  '"quoted', '(open', '```', 'and', ',', 'Just google it.', 'Wash it. Wash it.', '12 March 2024', '300 to 500 metres',
];
const texts = fc.array(fc.oneof(fc.constantFrom(...pieces), fc.string({ maxLength: 12 }), fc.string({ unit: 'grapheme', maxLength: 8 })), { maxLength: 30 }).map((parts) => parts.join(' '));

describe('spans always slice the original text to their evidence', () => {
  it('for tokens, sentences and every finding of every check (fast-check, 300 texts)', () => {
    fc.assert(
      fc.property(texts, texts, (text, prompt) => {
        const doc = analyze(text, { prompt: analyze(prompt) });
        doc.context.siblings = [analyze(`${text} Boil it for 3 minutes.`)];
        for (const t of doc.tokens) {
          expect(t.start).toBeGreaterThanOrEqual(0);
          expect(t.end).toBeLessThanOrEqual(text.length);
          expect(text.slice(t.start, t.end)).toBe(t.text);
        }
        for (const s of doc.sentences) expect(s.start <= s.end && s.end <= text.length).toBe(true);
        for (const q of doc.quantities) expect(text.slice(q.start, q.end)).toBe(q.text);
        for (const result of Object.values(runAllChecks(doc))) {
          expect(Number.isFinite(result.value)).toBe(true);
          for (const f of result.findings) {
            expect(f.start).toBeGreaterThanOrEqual(0);
            expect(f.end).toBeLessThanOrEqual(text.length);
            expect(f.start).toBeLessThanOrEqual(f.end);
            expect(text.slice(f.start, f.end)).toBe(f.evidence);
            if (f.related) expect(text.slice(f.related.start, f.related.end)).toBe(f.related.evidence);
          }
        }
      }),
      { numRuns: 300, seed: 48 },
    );
  });
});
