import { describe, expect, it } from 'vitest';
import { analyze, type Token } from '../../src/text/analyze.ts';
import { winkNegationFlags } from '../../src/text/wink-negation.ts';
import { NEGATION_TERMINATORS } from '../../src/text/word-lists.ts';
import { prng, syntheticResponse } from '../bench/corpus.ts';

const negatedWords = (text: string) =>
  analyze(text)
    .tokens.filter((t) => t.negated)
    .map((t) => t.text);

/**
 * Negation scope: NegEx lists (Chapman et al. 2001) with a window of eight words, extended by
 * wink-nlp's negation flags up to the first termination term or punctuation. Texts written for
 * this project.
 */
const CASES: { text: string; negated: string[] }[] = [
  { text: 'Never mix fuels.', negated: ['mix', 'fuels'] },
  { text: 'Do not cook inside the tent.', negated: ['cook', 'inside', 'the', 'tent'] },
  { text: 'Not only this but also that.', negated: [] },
  // past NegEx's eight words, wink-nlp's flags carry the scope to the end of the clause
  {
    text: 'Never leave the lit stove or the lantern running in the closed tent overnight.',
    negated: ['leave', 'the', 'lit', 'stove', 'or', 'the', 'lantern', 'running', 'in', 'the', 'closed', 'tent', 'overnight'],
  },
  // a termination term stops both readings
  { text: 'Never leave the lit stove or the lantern running, but open the vent in the tent overnight.', negated: ['leave', 'the', 'lit', 'stove', 'or', 'the', 'lantern', 'running'] },
];

describe('negation scope', () => {
  it.each(CASES)('$text', ({ text, negated }) => {
    expect(negatedWords(text)).toEqual(negated);
  });

  it('asks wink-nlp only about sentences where its flags can change the outcome', async () => {
    const { findNegation } = await import('../../src/text/negation.ts');
    const doc = analyze('Do not cook inside. It is cold. Never leave the lit stove or the lantern running in the closed tent overnight.');
    for (const t of doc.tokens) [t.negated, t.cue] = [false, false];
    const asked: number[] = [];
    findNegation(doc.tokens, doc.words, doc.sentences, (open) => {
      asked.push(...open.map((s) => s.index));
      return winkNegationFlags(doc.text, doc.tokens, open);
    });
    expect(asked).toEqual([2]);
  });

  // The generated responses hold no pseudo-negation after a cue, so punctuation and termination
  // terms are the only things that block a flag here.
  it('gives the same scopes as applying wink-nlp flags read for every sentence (500 generated responses)', () => {
    const random = prng(5);
    let compared = 0;
    for (let n = 0; n < 500; n++) {
      const doc = analyze(syntheticResponse(random, 1200));
      const all = winkNegationFlags(doc.text, doc.tokens, doc.sentences);
      for (const s of doc.sentences) {
        let blocked = true;
        for (let i = s.firstToken; i < s.endToken; i++) {
          const t: Token = doc.tokens[i];
          if (t.cue) blocked = false;
          else if (t.kind === 'punctuation' || NEGATION_TERMINATORS.has(t.lower)) blocked = true;
          else if (all[i] && !blocked) {
            compared++;
            expect(t.negated, `${doc.text.slice(s.start, s.end)} — "${t.text}"`).toBe(true);
          }
        }
      }
    }
    expect(compared).toBeGreaterThan(100);
  });
});
