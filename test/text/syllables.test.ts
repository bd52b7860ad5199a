import { describe, expect, it } from 'vitest';
import { daleChall } from 'dale-chall';
import { syllable } from 'syllable';
import { syllablesOf } from '../../src/text/syllables.ts';
import { cmuAlphabeticEntries, cmuSyllableTable, isHeldOut } from '../../src/text/cmu-syllables.ts';

describe('syllables against the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary, first pronunciation)', () => {
  it('agrees on at least 99% of the Dale–Chall familiar words found in CMU (list: Chall & Dale 1995, npm dale-chall)', () => {
    const cmu = cmuSyllableTable();
    const words = daleChall.map((w) => w.toLowerCase()).filter((w) => cmu.has(w));
    const exact = words.filter((w) => syllablesOf(w) === cmu.get(w)).length / words.length;
    console.log(`Dale–Chall words in CMU: ${words.length}; exact ${(exact * 100).toFixed(2)}%`);
    expect(words.length).toBeGreaterThan(2500);
    expect(exact).toBeGreaterThanOrEqual(0.99);
  });

  it('the fallback alone (dictionary off) beats npm syllable on the held-out tenth of CMU\'s alphabetic headwords', () => {
    const heldOut = cmuAlphabeticEntries().filter(([w]) => isHeldOut(w));
    const ours = heldOut.filter(([w, n]) => syllablesOf(w, { useDictionary: false }) === n).length / heldOut.length;
    const reference = heldOut.filter(([w, n]) => syllable(w) === n).length / heldOut.length;
    console.log(`held-out words: ${heldOut.length}; fallback ${(ours * 100).toFixed(2)}%, npm syllable ${(reference * 100).toFixed(2)}%`);
    expect(heldOut.length).toBeGreaterThan(10_000);
    expect(ours).toBeGreaterThan(reference);
  });

  const table: [string, number, string][] = [
    ['safety', 2, 'CMU: S EY1 F T IY0 (npm syllable says 3 — REFERENCES.md)'],
    ['area', 3, 'CMU: EH1 R IY0 AH0'],
    ['poem', 2, 'CMU: P OW1 AH0 M'],
    ['everything', 3, 'CMU: EH1 V R IY0 TH IH2 NG'],
    ["don't", 1, 'CMU: D OW1 N T'],
    ['well-known', 2, 'CMU: W EH1 L N OW1 N'],
    ['rain-soaked', 2, 'not in CMU: rain (R EY1 N) + soaked (S OW1 K T)'],
    ['trail-maintenance', 4, 'not in CMU: trail (T R EY1 L) + maintenance (M EY1 N T AH0 N AH0 N S)'],
    ['', 0, 'no letters'],
    ['42', 0, 'no letters'],
  ];
  for (const [word, expected, source] of table) {
    it(`"${word}" has ${expected} (${source})`, () => expect(syllablesOf(word)).toBe(expected));
  }
});
