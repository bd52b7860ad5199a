import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { flesch } from 'flesch';
import { fleschKincaid } from 'flesch-kincaid';
import { gunningFog as refGunningFog } from 'gunning-fog';
import { smogFormula } from 'smog-formula';
import { colemanLiau as refColemanLiau } from 'coleman-liau';
import { automatedReadability } from 'automated-readability';
import {
  automatedReadabilityIndex, colemanLiau, daleChall, fleschKincaidGrade, fleschReadingEase, gunningFog, smog, type ReadabilityCounts,
} from '../../src/text/readability/formulas.ts';

function counts(partial: Partial<ReadabilityCounts>): ReadabilityCounts {
  return { sentences: 0, words: 0, syllables: 0, polysyllables: 0, complexWords: 0, letters: 0, characters: 0, unfamiliarWords: 0, ...partial };
}

describe('worked values (REFERENCES.md; from the documentation of the npm reference packages, which implement the published coefficients)', () => {
  const table: { formula: string; f: (c: ReadabilityCounts) => number | null; c: Partial<ReadabilityCounts>; expected: number; source: string }[] = [
    { formula: 'Flesch Reading Ease', f: fleschReadingEase, c: { sentences: 1, words: 6, syllables: 6 }, expected: 116.145, source: 'Flesch (1948); npm flesch docs' },
    { formula: 'Flesch Reading Ease', f: fleschReadingEase, c: { sentences: 1, words: 12, syllables: 23 }, expected: 32.505, source: 'Flesch (1948); npm flesch docs' },
    { formula: 'Flesch–Kincaid grade', f: fleschKincaidGrade, c: { sentences: 1, words: 13, syllables: 26 }, expected: 13.08, source: 'Kincaid et al. (1975); npm flesch-kincaid docs' },
    { formula: 'Gunning fog', f: gunningFog, c: { sentences: 1, words: 13, complexWords: 2 }, expected: 11.3538, source: 'Gunning (1952); npm gunning-fog docs' },
    { formula: 'SMOG', f: smog, c: { sentences: 1, polysyllables: 4 }, expected: 14.5546, source: 'McLaughlin (1969); npm smog-formula docs' },
    { formula: 'Automated Readability Index', f: automatedReadabilityIndex, c: { sentences: 6, words: 151, characters: 623 }, expected: 10.586, source: 'Smith & Senter (1967); npm automated-readability docs' },
  ];
  for (const row of table) {
    it(`${row.formula}: ${JSON.stringify(row.c)} → ${row.expected} (${row.source})`, () => {
      expect(row.f(counts(row.c))).toBeCloseTo(row.expected, 3);
    });
  }

  it('Dale–Chall adds 3.6365 only when more than 5% of words are unfamiliar (Dale & Chall 1948; values computed from the published form)', () => {
    // 100 words, 10 sentences: PDW 5 → 0.1579·5 + 0.0496·10 = 1.2855; PDW 6 → 0.9474 + 0.496 + 3.6365 = 5.0799
    expect(daleChall(counts({ sentences: 10, words: 100, unfamiliarWords: 5 }))).toBeCloseTo(1.2855, 4);
    expect(daleChall(counts({ sentences: 10, words: 100, unfamiliarWords: 6 }))).toBeCloseTo(5.0799, 4);
  });

  it('Coleman–Liau uses 0.0588 (Coleman & Liau 1975): 100 words, 450 letters, 5 sentences → 9.18', () => {
    expect(colemanLiau(counts({ sentences: 5, words: 100, letters: 450 }))).toBeCloseTo(0.0588 * 450 - 0.296 * 5 - 15.8, 9);
    expect(colemanLiau(counts({ sentences: 5, words: 100, letters: 450 }))).toBeCloseTo(9.18, 3);
  });

  it('gives null, never NaN, when a denominator is zero', () => {
    for (const f of [fleschReadingEase, fleschKincaidGrade, gunningFog, smog, colemanLiau, automatedReadabilityIndex, daleChall]) {
      expect(f(counts({}))).toBeNull();
    }
  });
});

describe('agreement with the per-formula npm reference packages on 300 generated count sets (to 1e-9)', () => {
  const arbitraryCounts = fc
    .record({ sentences: fc.integer({ min: 1, max: 400 }), words: fc.integer({ min: 1, max: 20_000 }), perWord: fc.double({ min: 1, max: 4, noNaN: true }), poly: fc.double({ min: 0, max: 1, noNaN: true }), letters: fc.double({ min: 1, max: 12, noNaN: true }) })
    .map((r) => {
      const syllables = Math.round(r.words * r.perWord);
      const polysyllables = Math.round(r.words * r.poly * 0.5);
      const letters = Math.round(r.words * r.letters);
      return counts({ sentences: r.sentences, words: r.words, syllables, polysyllables, complexWords: Math.round(polysyllables * 0.8), letters, characters: letters + Math.round(r.words * 0.1) });
    });

  it('matches flesch, flesch-kincaid, gunning-fog, smog-formula, coleman-liau and automated-readability', () => {
    fc.assert(
      fc.property(arbitraryCounts, (c) => {
        const ref = { sentence: c.sentences, word: c.words, syllable: c.syllables, polysillabicWord: c.polysyllables, complexPolysillabicWord: c.complexWords, letter: c.letters, character: c.characters };
        expect(Math.abs(fleschReadingEase(c)! - flesch(ref))).toBeLessThan(1e-9);
        expect(Math.abs(fleschKincaidGrade(c)! - fleschKincaid(ref))).toBeLessThan(1e-9);
        expect(Math.abs(gunningFog(c)! - refGunningFog(ref))).toBeLessThan(1e-9);
        expect(Math.abs(smog(c)! - smogFormula(ref))).toBeLessThan(1e-9);
        expect(Math.abs(colemanLiau(c)! - refColemanLiau(ref))).toBeLessThan(1e-9);
        expect(Math.abs(automatedReadabilityIndex(c)! - automatedReadability(ref))).toBeLessThan(1e-9);
      }),
      { numRuns: 300, seed: 20261201 },
    );
  });
});
