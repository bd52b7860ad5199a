import { daleChall as familiarList } from 'dale-chall';
import type { Doc, Token } from '../analyze.ts';
import { isWord } from '../analyze.ts';
import { syllablesOf } from '../syllables.ts';
import type { ReadabilityCounts } from './formulas.ts';

const FAMILIAR = new Set(familiarList.map((w) => w.toLowerCase()));
const LETTER = /\p{L}/gu;
const ALNUM = /[\p{L}\p{N}]/gu;

/**
 * A word is familiar (Dale–Chall) when it, or the base of a regular inflection of it, is on the
 * list: -s, -es, -ies→y, -ed, -d, -ied→y, -ing, -er, -est, -ly. Numbers count as familiar.
 */
export function isFamiliar(lower: string): boolean {
  if (FAMILIAR.has(lower) || /^[\d.,:]+$/.test(lower)) return true;
  const bases: string[] = [];
  if (lower.endsWith('ies') || lower.endsWith('ied')) bases.push(`${lower.slice(0, -3)}y`);
  if (lower.endsWith('es') || lower.endsWith('ed') || lower.endsWith('er') || lower.endsWith('ly')) bases.push(lower.slice(0, -2));
  if (lower.endsWith('s') || lower.endsWith('d')) bases.push(lower.slice(0, -1));
  if (lower.endsWith('ing')) bases.push(lower.slice(0, -3), `${lower.slice(0, -3)}e`);
  if (lower.endsWith('est')) bases.push(lower.slice(0, -3));
  if (lower.endsWith('ier') || lower.endsWith('iest')) bases.push(`${lower.replace(/iest$|ier$/, '')}y`);
  return bases.some((b) => b.length > 1 && FAMILIAR.has(b));
}

/**
 * Gunning's complex word: 3+ syllables, but not a proper noun (capitalised inside a sentence),
 * not a hyphenated compound, and not one that reaches 3 only through -es, -ed or -ing.
 */
function isComplex(token: Token, sentenceStart: boolean): boolean {
  if (token.syllables < 3 || token.kind !== 'word') return false;
  if (token.text.includes('-')) return false;
  if (!sentenceStart && /^\p{Lu}/u.test(token.text)) return false;
  const suffix = token.lower.match(/(es|ed|ing)$/);
  if (suffix && syllablesOf(token.lower.slice(0, -suffix[1].length)) < 3 && token.syllables - 1 < 3) return false;
  return true;
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
    const next = doc.tokens[i + 1];
    const surface = next?.clitic && next.start === t.end ? t.text + next.text : t.text;
    counts.words++;
    counts.syllables += t.syllables;
    if (t.syllables >= 3) counts.polysyllables++;
    if (isComplex(t, firstWordOfSentence)) counts.complexWords++;
    counts.letters += surface.match(LETTER)?.length ?? 0;
    counts.characters += surface.match(ALNUM)?.length ?? 0;
    if (!isFamiliar(surface.toLowerCase().replace(/’/g, "'"))) counts.unfamiliarWords++;
    firstWordOfSentence = false;
  }
  return counts;
}
