import type { Doc, Token } from '../text/analyze.ts';
import { phraseIndex } from '../text/phrase-index.ts';
import type { Span } from './define-check.ts';

/**
 * Every match of `phrases` in a document, as spans of its original text. Phrases match whole
 * words, case-insensitively, ignoring punctuation between words; a trailing `*` makes the last
 * word a prefix ("ventilat*" matches "ventilation"). Lists are compiled once per list object.
 */
export function findPhrases(doc: Doc, phrases: readonly string[]): Span[] {
  return phraseIndex(phrases).find(doc);
}

/** The index of the token containing character `offset` (or the next one after it). */
export function tokenIndexAt(doc: Doc, offset: number): number {
  let lo = 0;
  let hi = doc.tokens.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (doc.tokens[mid].end <= offset) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export function tokenAt(doc: Doc, offset: number): Token | undefined {
  return doc.tokens[tokenIndexAt(doc, offset)];
}

/** The sentence containing character `offset`, as a span (the whole text when there is none). */
export function sentenceSpanAt(doc: Doc, offset: number): Span {
  const token = tokenAt(doc, offset);
  const sentence = token ? doc.sentences[token.sentence] : undefined;
  return sentence ? { start: sentence.start, end: sentence.end } : { start: 0, end: doc.text.length };
}

/** The first sentence, or the trimmed text when there is none. */
export function openingSpan(doc: Doc): Span {
  const first = doc.sentences[0];
  if (first) return { start: first.start, end: first.end };
  const start = doc.text.length - doc.text.trimStart().length;
  return { start, end: doc.text.trimEnd().length };
}
