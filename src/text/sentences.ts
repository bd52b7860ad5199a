import type { RawToken } from './tokenize.ts';

/** Titles and Latin abbreviations after which the next word never starts a sentence. */
const NON_FINAL = new Set(['dr.', 'mr.', 'mrs.', 'ms.', 'prof.', 'st.', 'sr.', 'jr.', 'vs.', 'e.g.', 'i.e.', 'cf.', 'approx.', 'fig.', 'mt.']);

const TERMINATORS = new Set(['.', '!', '?', '…', '。', '！', '？']);
const CLOSERS = new Set(['"', "'", '”', '’', ')', ']', '}', '»']);
const LIST_MARKERS = new Set(['-', '*', '•', '–', '—', '#', '>']);

/**
 * Where sentences end, as token ranges `[first, end)` covering every token. A sentence ends:
 * after a terminator run (. ! ? … with closing quotes and brackets) followed by white space and
 * a word that does not start in lower case; after an initialism or abbreviation followed by a
 * capitalised word (never after a title such as "Dr." or "e.g."); at a blank line; and at a
 * line break that starts a list item or heading. A number and full stop opening a line ("1.")
 * is a list marker, not a sentence.
 */
export function splitSentences(text: string, tokens: RawToken[]): [number, number][] {
  const out: [number, number][] = [];
  let first = 0;
  let lineStart = 0; // index of the first token on the current line
  const close = (end: number) => {
    if (end > first) out.push([first, end]);
    first = end;
  };
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    if (t.kind === 'space') {
      const heading = lineStart < i && i > first && text.charCodeAt(tokens[lineStart].start) === 35; // '#'
      lineStart = i + 1;
      if (heading || blankLine(text, t) || (i + 1 < tokens.length && startsListItem(text, tokens, i + 1))) close(i + 1);
      continue;
    }
    const value = text.slice(t.start, t.end);
    const isTerminator = t.kind === 'punctuation' && (TERMINATORS.has(value) || value.startsWith('..'));
    const isAbbreviation = t.kind === 'word' && value.endsWith('.');
    if (!isTerminator && !isAbbreviation) continue;
    // "1." opening a line is a list marker
    if (value === '.' && i - 1 === lineStart && tokens[i - 1].kind === 'number') continue;
    let end = i + 1;
    while (end < tokens.length && tokens[end].start === tokens[end - 1].end && tokens[end].kind === 'punctuation') {
      const v = text.slice(tokens[end].start, tokens[end].end);
      if (!TERMINATORS.has(v) && !CLOSERS.has(v) && !v.startsWith('..')) break;
      end++;
    }
    const next = tokens[end];
    if (!next) {
      close(end);
      break;
    }
    if (next.start === tokens[end - 1].end && next.kind !== 'space') {
      i = end - 1;
      continue; // no white space after: not a boundary ("3.5", "a.b")
    }
    if (isAbbreviation && (NON_FINAL.has(value.toLowerCase()) || !startsCapital(text, next))) continue;
    if (isTerminator && startsLower(text, next)) continue;
    close(end);
    i = end - 1;
  }
  close(tokens.length);
  return out;
}

function blankLine(text: string, t: RawToken): boolean {
  let breaks = 0;
  for (let i = t.start; i < t.end; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || (c === 13 && text.charCodeAt(i + 1) !== 10)) breaks++;
  }
  return breaks >= 2;
}

function startsListItem(text: string, tokens: RawToken[], i: number): boolean {
  const t = tokens[i];
  const value = text.slice(t.start, t.end);
  if (t.kind === 'punctuation' || t.kind === 'symbol') return LIST_MARKERS.has(value);
  if (t.kind === 'number') {
    const after = tokens[i + 1];
    if (!after || after.start !== t.end) return false;
    const mark = text.slice(after.start, after.end);
    return mark === '.' || mark === ')';
  }
  return t.kind === 'emoji';
}

function startsLower(text: string, t: RawToken): boolean {
  if (t.kind !== 'word') return false;
  const ch = text[t.start];
  return ch !== ch.toUpperCase() && ch === ch.toLowerCase();
}

function startsCapital(text: string, t: RawToken): boolean {
  if (t.kind !== 'word') return false;
  const ch = text[t.start];
  return ch === ch.toUpperCase() && ch !== ch.toLowerCase();
}
