import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyze, type Doc, type Token } from '../../src/text/analyze.ts';

// Words that share stems ("boil", "boiling", "boiled"), contractions ("don't" is "do" + "n't"),
// numbers, case variants and a word over 64 characters (which gets no cached facts).
const LONG = 'x'.repeat(70);
const pieces = ['Boil', 'boil', 'boiling', 'boiled', "don't", 'do', 'not', "can't", 'can', '10', '10', '3.5', 'water', 'Water', 'waters', LONG, `${LONG}s`, LONG.toUpperCase(), 'café', '😀', '.', '\n\n'];
const texts = fc.array(fc.oneof(fc.constantFrom(...pieces), fc.string({ maxLength: 6 })), { maxLength: 40 }).map((parts) => parts.join(' '));

/** Do equal ids stand for exactly the equal values, numbered 0 … kinds − 1? */
function expectNumbering(tokens: Token[], idOf: (t: Token) => number, valueOf: (t: Token) => string, kinds: number): void {
  const byValue = new Map<string, number>();
  const byId = new Map<number, string>();
  for (const t of tokens) {
    const id = idOf(t);
    expect(id).toBeGreaterThanOrEqual(0);
    expect(id).toBeLessThan(kinds);
    expect(byValue.get(valueOf(t)) ?? id).toBe(id);
    expect(byId.get(id) ?? valueOf(t)).toBe(valueOf(t));
    byValue.set(valueOf(t), id);
    byId.set(id, valueOf(t));
  }
  expect(byId.size).toBe(kinds);
}

function expectIds(doc: Doc): void {
  expectNumbering(doc.wordTokens, (t) => t.wordId, (t) => t.lower, doc.wordKinds);
  expectNumbering(doc.wordTokens, (t) => t.stemId, (t) => (t.kind === 'number' ? t.facts!.stem : t.stem), doc.stemKinds);
  for (const t of doc.tokens) if (!doc.wordTokens.includes(t)) expect([t.wordId, t.stemId]).toEqual([-1, -1]);
}

describe('word and stem ids: within a document, equal exactly when the lower-case word (stem) is equal', () => {
  it('for generated texts, each analysed after many others (fast-check, 300 texts)', () => {
    fc.assert(
      fc.property(texts, (text) => expectIds(analyze(text))),
      { numRuns: 300, seed: 17 },
    );
  });

  it.each([
    { text: "Boil it. Boiling works; boiled water is safe. Don't do it, do not.", words: ['boil', 'it', 'boiling', 'works', 'boiled', 'water', 'is', 'safe', 'do', 'do', 'it', 'do', 'not'], sameStem: [['boil', 'boiling', 'boiled']] },
    { text: `${LONG} and ${LONG}.`, words: [LONG, 'and', LONG], sameStem: [] },
  ])('$text', ({ text, words, sameStem }) => {
    const doc = analyze(text);
    expect(doc.wordTokens.map((t) => t.lower)).toEqual(words);
    expectIds(doc);
    for (const group of sameStem) {
      const ids = new Set(doc.wordTokens.filter((t) => group.includes(t.lower)).map((t) => t.stemId));
      expect(ids.size).toBe(1);
    }
  });
});
