import type { Doc, Token } from '../text/analyze.ts';
import type { Span } from './define-check.ts';

/**
 * Compiles phrases into one case-insensitive regular expression that matches whole words only:
 * spaces match any run of white space, apostrophes match ' or ’, and a trailing `*` makes a
 * phrase a prefix ("ventilat*" matches "ventilation"). Built once per phrase list.
 */
export function phraseMatcher(phrases: readonly string[]): RegExp | null {
  const cleaned = phrases.map((p) => p.trim()).filter(Boolean);
  if (cleaned.length === 0) return null;
  const alternatives = [...new Set(cleaned)]
    .sort((a, b) => b.length - a.length)
    .map((p) => {
      const prefix = p.endsWith('*');
      const body = (prefix ? p.slice(0, -1) : p)
        .replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
        .replace(/\s+/g, '\\s+')
        .replace(/['’]/g, "['’]");
      const startBoundary = /^[\p{L}\p{N}]/u.test(p) ? '(?<![\\p{L}\\p{N}])' : '';
      const endBoundary = prefix || !/[\p{L}\p{N}]$/u.test(p) ? '' : '(?![\\p{L}\\p{N}])';
      return `${startBoundary}${body}${prefix ? '[\\p{L}\\p{N}]*' : ''}${endBoundary}`;
    });
  return new RegExp(alternatives.join('|'), 'giu');
}

const cache = new WeakMap<readonly string[], RegExp | null>();

/** `phraseMatcher`, memoised per list object (rubric lists are built once). */
export function cachedMatcher(phrases: readonly string[]): RegExp | null {
  if (!cache.has(phrases)) cache.set(phrases, phraseMatcher(phrases));
  return cache.get(phrases)!;
}

/** Every match of `phrases` in `text[from, to)`, as spans of the original text. */
export function findPhrases(text: string, phrases: readonly string[], from = 0, to = text.length): Span[] {
  const regex = cachedMatcher(phrases);
  if (!regex) return [];
  const out: Span[] = [];
  regex.lastIndex = 0;
  const slice = from === 0 && to === text.length ? text : text.slice(from, to);
  for (const m of slice.matchAll(regex)) out.push({ start: from + m.index!, end: from + m.index! + m[0].length });
  return out;
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
