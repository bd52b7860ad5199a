import type { Doc, Token } from '../analyze.ts';
import { isWord } from '../analyze.ts';
import { complexByInflectionOnly } from '../word-facts.ts';
import type { ReadabilityCounts } from './formulas.ts';

/**
 * Gunning's complex word: 3+ syllables, but not a proper noun (capitalised inside a sentence),
 * not a hyphenated compound, and not one that reaches 3 only through -es, -ed or -ing.
 */
function isComplex(token: Token, sentenceStart: boolean): boolean {
  if (token.syllables < 3 || token.kind !== 'word') return false;
  if (token.text.includes('-')) return false;
  if (!sentenceStart && /^\p{Lu}/u.test(token.text)) return false;
  return !(token.facts ? token.facts.complexByInflectionOnly : complexByInflectionOnly(token.lower, token.syllables));
}

/** Sentences that hold at least one word. */
export function wordSentences(doc: Doc) {
  return doc.sentences.filter((s) => s.words > 0);
}

/** Counts a token range for the readability formulas; `doc.tokens` by default. */
export function readabilityCounts(doc: Doc, from = 0, to = doc.tokens.length): ReadabilityCounts {
  const counts: ReadabilityCounts = { sentences: 0, words: 0, syllables: 0, polysyllables: 0, complexWords: 0, letters: 0, characters: 0, unfamiliarWords: 0 };
  let lastSentence = -1;
  let firstWordOfSentence = true;
  for (let i = from; i < to; i++) {
    const t = doc.tokens[i];
    if (t.sentence !== lastSentence) {
      lastSentence = t.sentence;
      firstWordOfSentence = true;
    }
    if (!isWord(t)) continue;
    if (firstWordOfSentence) counts.sentences++;
    counts.words++;
    counts.syllables += t.syllables;
    if (t.syllables >= 3) counts.polysyllables++;
    if (isComplex(t, firstWordOfSentence)) counts.complexWords++;
    if (t.facts) {
      counts.letters += t.facts.letters;
      counts.characters += t.facts.characters;
      if (!t.facts.familiar) counts.unfamiliarWords++;
    } else {
      // a word too long to memoise (over 64 characters): count it directly
      counts.letters += t.text.match(/\p{L}/gu)?.length ?? 0;
      counts.characters += t.text.match(/[\p{L}\p{N}]/gu)?.length ?? 0;
      counts.unfamiliarWords++;
    }
    firstWordOfSentence = false;
  }
  return counts;
}
