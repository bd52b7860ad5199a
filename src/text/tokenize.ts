import type { Token, TokenKind } from './analyze.ts';

/** What the sentence splitter reads of a token: a kind and a `[start, end)` range of UTF-16 offsets. */
export interface RawToken {
  start: number;
  end: number;
  kind: TokenKind;
}

/** Words that keep their full stop ("Dr.", "e.g."): no sentence ends there. */
const ABBREVIATIONS = new Set(['dr', 'mr', 'mrs', 'ms', 'prof', 'st', 'sr', 'jr', 'vs', 'etc', 'approx', 'cf', 'fig', 'mt']);

const CLITIC_TAILS = new Set(['s', 're', 'll', 've', 'd', 'm']);
const EMOTICONS = [':-)', ':-(', ':-D', ':-P', ';-)', ':)', ':(', ':D', ':P', ':p', ';)', ':/', '<3'];
const URL_STARTS = ['https://', 'http://', 'www.'];

const LETTER_OR_MARK = /[\p{L}\p{M}]/u;
const LATIN_LIKE = /[\p{Script=Latin}\p{Script=Greek}\p{Script=Cyrillic}]/u;
const PICTOGRAPH = /\p{Extended_Pictographic}|\p{Regional_Indicator}/u;
const CURRENCY = /\p{Sc}/u;
const URL_TRAIL = /[.,;:!?)\]}"'’”]+$/;
const EMAIL = /^[\p{L}\p{N}._%+-]+@[\p{L}\p{N}-]+(\.[\p{L}\p{N}-]+)+$/u;

const PUNCTUATION = new Set([...'.,;:!?"\'“”‘’()[]{}-–—/\\…«»¿¡。、！？「」『』'].map((c) => c.charCodeAt(0)));

function isAsciiLetter(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90);
}

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

/** Spaces between tokens (tabs and line breaks are tokens of their own). */
function isGap(c: number): boolean {
  return c === 32 || c === 0xa0 || c === 0x0b || c === 0x0c || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff;
}

function isBreak(c: number): boolean {
  return c === 10 || c === 13 || c === 9;
}

/** The characters JavaScript's `\s` matches: gaps and breaks. */
export function isSpaceCode(c: number): boolean {
  return isGap(c) || isBreak(c);
}

/** The code point at `i` as a string (both halves of a surrogate pair). */
function charAt(text: string, i: number): string {
  const c = text.charCodeAt(i);
  return c >= 0xd800 && c <= 0xdbff && i + 1 < text.length ? text.slice(i, i + 2) : text[i];
}

/** A letter (or combining mark) of any script, by code point. */
function isLetterAt(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  if (c < 128) return isAsciiLetter(c);
  if (Number.isNaN(c)) return false;
  return LETTER_OR_MARK.test(charAt(text, i));
}

/** A character that continues a word: letter, mark or digit. */
function isWordCharAt(text: string, i: number): boolean {
  const c = text.charCodeAt(i);
  return isDigit(c) || isLetterAt(text, i);
}

function isApostrophe(c: number): boolean {
  return c === 39 || c === 0x2019;
}

/**
 * Splits a text into tokens in one pass over its characters: words (with internal apostrophes,
 * hyphens and ampersands, abbreviations with their full stops, contractions split as
 * "do" + "n't"), numbers (decimals, thousands, times, dates, ordinals), URLs, e-mail addresses,
 * emoji and emoticons, punctuation, symbols, runs of tabs and line breaks ('space'), and runs of
 * other scripts ('other'). Spaces separate tokens and are not tokens. Time is linear in the
 * length of the text, whatever it holds. Tokens come with their text and lower case; the other
 * fields are left for the analysis to fill in.
 *
 * @example
 * tokenize("Don't.").map((t) => t.kind) // ['word', 'word', 'punctuation'] ("Do", "n't", ".")
 */
class TokenRecord implements Token {
  sentence = 0;
  negated = false;
  cue = false;
  stem = '';
  wordId = -1;
  stemId = -1;
  syllables = 0;
  facts: Token['facts'] = null;
  stop: boolean;
  constructor(public start: number, public end: number, public text: string, public lower: string, public kind: TokenKind, public clitic: boolean) {
    this.stop = clitic;
  }
}

export function tokenize(text: string): Token[] {
  const out: Token[] = [];
  const n = text.length;
  const scan = { noAtBefore: 0 };
  let i = 0;
  const push = (start: number, end: number, kind: TokenKind, clitic = false) => {
    const value = text.slice(start, end);
    // the analysis fills in sentence, negation, stem, syllables and facts
    const lower = kind === 'word' || kind === 'other' || kind === 'url' || kind === 'email' ? value.toLowerCase() : value;
    out.push(new TokenRecord(start, end, value, lower, kind, clitic));
  };
  while (i < n) {
    const c = text.charCodeAt(i);
    if (isGap(c)) {
      i++;
      continue;
    }
    if (isBreak(c)) {
      let j = i + 1;
      while (j < n && isBreak(text.charCodeAt(j))) j++;
      push(i, j, 'space');
      i = j;
      continue;
    }
    const atTokenStart = out.length === 0 || out[out.length - 1].end !== i;
    if (atTokenStart && (c === 104 || c === 72 || c === 119 || c === 87)) {
      const end = urlEnd(text, i);
      if (end > i) {
        push(i, end, 'url');
        i = end;
        continue;
      }
    }
    if (isDigit(c) || ((c === 43 || c === 45) && atTokenStart && isDigit(text.charCodeAt(i + 1)) && !isWordCharAt(text, i - 1))) {
      const email = atTokenStart ? emailEnd(text, i, scan) : -1;
      if (email > i) {
        push(i, email, 'email');
        i = email;
        continue;
      }
      i = number(text, i, push);
      continue;
    }
    if ((c === 35 || c === 64) && atTokenStart && isWordCharAt(text, i + 1)) {
      let j = i + 1;
      while (j < n && (isWordCharAt(text, j) || text.charCodeAt(j) === 95)) j++;
      push(i, j, 'word');
      i = j;
      continue;
    }
    if (isLetterAt(text, i)) {
      const email = atTokenStart ? emailEnd(text, i, scan) : -1;
      if (email > i) {
        push(i, email, 'email');
        i = email;
        continue;
      }
      if (c >= 128 && !LATIN_LIKE.test(charAt(text, i))) {
        let j = i;
        while (j < n && isWordCharAt(text, j) && (text.charCodeAt(j) < 128 || !LATIN_LIKE.test(charAt(text, j)))) j += charAt(text, j).length;
        while (j < n && !isGap(text.charCodeAt(j)) && !isBreak(text.charCodeAt(j)) && !PUNCTUATION.has(text.charCodeAt(j)) && !LATIN_LIKE.test(charAt(text, j)) && !isDigit(text.charCodeAt(j))) j += charAt(text, j).length;
        push(i, j, 'other');
        i = j;
        continue;
      }
      i = word(text, i, push);
      continue;
    }
    const emoticon = atTokenStart ? EMOTICONS.find((e) => text.startsWith(e, i) && !isWordCharAt(text, i + e.length)) : undefined;
    if (emoticon) {
      push(i, i + emoticon.length, 'emoji');
      i += emoticon.length;
      continue;
    }
    if (c === 46 && text.charCodeAt(i + 1) === 46) {
      let j = i + 2;
      while (j < n && text.charCodeAt(j) === 46) j++;
      push(i, j, 'punctuation');
      i = j;
      continue;
    }
    if (PUNCTUATION.has(c)) {
      push(i, i + 1, 'punctuation');
      i++;
      continue;
    }
    const ch = charAt(text, i);
    if (c >= 128 && PICTOGRAPH.test(ch)) {
      i = emoji(text, i, push);
      continue;
    }
    push(i, i + ch.length, CURRENCY.test(ch) || (c < 128 && c > 32) ? 'symbol' : 'other');
    i += ch.length;
  }
  return out;
}

/** The end of a URL starting at `i` (http://, https://, www.), or -1. */
function urlEnd(text: string, i: number): number {
  const head = text.slice(i, i + 8).toLowerCase();
  const scheme = URL_STARTS.find((s) => head.startsWith(s));
  if (!scheme || !isWordCharAt(text, i + scheme.length)) return -1;
  let j = i + scheme.length;
  while (j < text.length && !isGap(text.charCodeAt(j)) && !isBreak(text.charCodeAt(j)) && text.charCodeAt(j) !== 60 && text.charCodeAt(j) !== 34) j++;
  const trail = URL_TRAIL.exec(text.slice(Math.max(i, j - 20), j));
  return trail ? j - trail[0].length : j;
}

/**
 * The end of an e-mail address starting at `i`, or -1 (only runs holding an @ are tried).
 * `scan.noAtBefore` remembers where a run without an @ ended, so the words of a long run
 * ("a.b.c.d…") are not each scanned again: time stays linear.
 */
function emailEnd(text: string, i: number, scan: { noAtBefore: number }): number {
  if (i < scan.noAtBefore) return -1;
  let j = i;
  let at = -1;
  while (j < text.length && j - i < 254) {
    const c = text.charCodeAt(j);
    if (c === 64) at = j;
    else if (!(isWordCharAt(text, j) || c === 46 || c === 95 || c === 37 || c === 43 || c === 45)) break;
    j++;
  }
  if (at < 0) {
    if (j - i < 254) scan.noAtBefore = j;
    return -1;
  }
  while (j > at && text.charCodeAt(j - 1) === 46) j--;
  return EMAIL.test(text.slice(i, j)) ? j : -1;
}

type Push = (start: number, end: number, kind: TokenKind, clitic?: boolean) => void;

/** A number: sign, digits with inner . , : / - between digits, an ordinal suffix. */
function number(text: string, i: number, push: Push): number {
  let j = i + 1;
  const n = text.length;
  for (;;) {
    while (j < n && isDigit(text.charCodeAt(j))) j++;
    const sep = text.charCodeAt(j);
    if ((sep === 46 || sep === 44 || sep === 58 || sep === 47 || sep === 45) && isDigit(text.charCodeAt(j + 1))) {
      j++;
      continue;
    }
    break;
  }
  const suffix = text.slice(j, j + 2).toLowerCase();
  if ((suffix === 'st' || suffix === 'nd' || suffix === 'rd' || suffix === 'th') && !isWordCharAt(text, j + 2)) j += 2;
  push(i, j, 'number');
  return j;
}

/**
 * A word from `i`: letters, marks and digits, joined across an apostrophe, hyphen, ampersand or
 * underscore that has a letter or digit on both sides; "U.S."-style initialisms and listed
 * abbreviations keep their full stops; a contraction's tail becomes a clitic token of its own.
 */
function word(text: string, i: number, push: Push): number {
  const n = text.length;
  let j = i;
  for (;;) {
    while (j < n && isWordCharAt(text, j)) j += charAt(text, j).length;
    const c = text.charCodeAt(j);
    if ((isApostrophe(c) || c === 45 || c === 38 || c === 95 || c === 0x2010 || c === 0x2011) && isWordCharAt(text, j + 1)) {
      j++;
      continue;
    }
    break;
  }
  // initialisms: single letters with full stops ("U.S.", "e.g.", "p.m.")
  if (text.charCodeAt(j) === 46 && j - i === 1 && isLetterAt(text, j + 1) && text.charCodeAt(j + 2) === 46) {
    let k = j;
    while (text.charCodeAt(k) === 46 && isLetterAt(text, k + 1) && !isWordCharAt(text, k + 2)) k += 2;
    if (text.charCodeAt(k) === 46) {
      push(i, k + 1, 'word');
      return k + 1;
    }
  }
  if (text.charCodeAt(j) === 46 && j - i <= 6 && ABBREVIATIONS.has(text.slice(i, j).toLowerCase())) {
    push(i, j + 1, 'word');
    return j + 1;
  }
  // contractions: "don't" → "do" + "n't", "cannot" → "can" + "not", "it's" → "it" + "'s"
  const apostrophe = lastApostrophe(text, i, j);
  if (apostrophe > i) {
    const tail = text.slice(apostrophe + 1, j).toLowerCase();
    const beforeN = text.charCodeAt(apostrophe - 1);
    if (tail === 't' && (beforeN === 110 || beforeN === 78) && apostrophe - 1 > i) {
      push(i, apostrophe - 1, 'word');
      push(apostrophe - 1, j, 'word', true);
      return j;
    }
    if (CLITIC_TAILS.has(tail)) {
      push(i, apostrophe, 'word');
      push(apostrophe, j, 'word', true);
      return j;
    }
  }
  if (j - i === 6 && text.slice(i, j).toLowerCase() === 'cannot') {
    push(i, i + 3, 'word');
    push(i + 3, j, 'word');
    return j;
  }
  push(i, j, 'word');
  return j;
}

function lastApostrophe(text: string, from: number, to: number): number {
  for (let k = to - 1; k > from && k >= to - 4; k--) if (isApostrophe(text.charCodeAt(k))) return k;
  return -1;
}

/** An emoji with its modifiers, variation selectors and zero-width-joined parts. */
function emoji(text: string, i: number, push: Push): number {
  let j = i + charAt(text, i).length;
  if (/\p{Regional_Indicator}/u.test(charAt(text, i))) {
    // a flag is a pair of regional indicators
    if (j < text.length && /\p{Regional_Indicator}/u.test(charAt(text, j))) j += 2;
    push(i, j, 'emoji');
    return j;
  }
  for (;;) {
    const c = text.charCodeAt(j);
    if (c === 0xfe0f || c === 0x20e3) j++;
    else if (c === 0xd83c && text.charCodeAt(j + 1) >= 0xdffb && text.charCodeAt(j + 1) <= 0xdfff) j += 2; // skin tones
    else if (c === 0x200d && j + 1 < text.length && PICTOGRAPH.test(charAt(text, j + 1))) j += 1 + charAt(text, j + 1).length;
    else break;
  }
  push(i, j, 'emoji');
  return j;
}
