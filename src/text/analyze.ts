import { syllablesOf } from './syllables.ts';
import { winkReader } from './wink-reader.ts';
import { wordFacts, type WordFacts } from './word-facts.ts';
import { findNegation, type NegationCue } from './negation.ts';
import { findQuantities, type Quantity } from './quantities.ts';

export type TokenKind = 'word' | 'number' | 'punctuation' | 'emoji' | 'space' | 'symbol' | 'url' | 'email' | 'other';

/** One token; `[start, end)` are UTF-16 offsets into the original text. */
export interface Token {
  start: number;
  end: number;
  text: string;
  lower: string;
  kind: TokenKind;
  sentence: number;
  /** Inside the scope of a negation cue. */
  negated: boolean;
  /** Is itself (part of) a negation cue. */
  cue: boolean;
  /** A contraction's tail ("n't", "'s"): part of the word before it, not a word of its own. */
  clitic: boolean;
  stop: boolean;
  /** Porter stem of `lower` for words, '' otherwise. */
  stem: string;
  /** Syllables of the surface word (with its clitic, so "don't" is one word of 1 syllable); 0 for non-words. */
  syllables: number;
  /** Facts about the surface word (familiarity, letters …); null for tokens that are not words. */
  facts: WordFacts | null;
}

/** A sentence as a range of tokens `[firstToken, endToken)` and of characters `[start, end)`. */
export interface Sentence {
  index: number;
  start: number;
  end: number;
  firstToken: number;
  endToken: number;
  /** Words in it (numbers count, clitics do not). */
  words: number;
}

/**
 * A word as phrase lists see it: a whitespace-delimited run of tokens (so "ca" + "n't" is
 * "can't" and "100" + "%" is "100%"), normalised, with the span of its core (edge punctuation
 * left out) and the tokens it covers.
 */
export interface MatchWord {
  norm: string;
  /** The first two characters of `norm`, for prefix phrases. */
  head: string;
  start: number;
  end: number;
  firstToken: number;
  lastToken: number;
  sentence: number;
}

export interface AnalysisContext {
  prompt?: Doc;
  siblings?: Doc[];
}

/** A text read once: everything a check needs, with offsets into `text`. */
export interface Doc {
  text: string;
  tokens: Token[];
  /** The tokens that count as words (`isWord`), in order. */
  wordTokens: Token[];
  sentences: Sentence[];
  /** Words for phrase matching (see `MatchWord`). */
  words: MatchWord[];
  cues: NegationCue[];
  quantities: Quantity[];
  context: AnalysisContext;
}

const KIND: Record<string, TokenKind> = {
  word: 'word',
  number: 'number',
  ordinal: 'number',
  punctuation: 'punctuation',
  emoji: 'emoji',
  emoticon: 'emoji',
  tabCRLF: 'space',
  symbol: 'symbol',
  currency: 'symbol',
  url: 'url',
  email: 'email',
  hashtag: 'word',
  mention: 'word',
};

const CLITIC = /^(n't|'s|'re|'ll|'ve|'d|'m|’s|’re|’ll|’ve|’d|’m|n’t)$/i;

/** True for tokens that count as words in readability and content measures. */
export function isWord(token: Token): boolean {
  return (token.kind === 'word' || token.kind === 'number') && !token.clitic;
}

/**
 * Reads a text once into a `Doc`: tokens with offsets, sentences, negation cues and scope,
 * stems, syllables, and quantities with their sentence. The context (prompt, sibling responses)
 * must already be analysed; use `analyzeItem` to analyse a prompt and its responses together.
 * Never throws on any string.
 *
 * @example
 * const doc = analyze('Never mix fuels.');
 * doc.tokens[1].negated // true
 */
export function analyze(text: string, context: AnalysisContext = {}): Doc {
  const { read, runs } = shieldLongRuns(text);
  const wdoc = winkReader().readDoc(read);
  const its = winkReader().its;
  const values = wdoc.tokens().out(its.value) as string[];
  const spaces = wdoc.tokens().out(its.precedingSpaces) as string[];
  const types = wdoc.tokens().out(its.type) as string[];
  const winkNegated = wdoc.tokens().out(its.negationFlag) as unknown as boolean[];
  const spans = wdoc.sentences().out(its.span) as unknown as [number, number][];

  const tokens: Token[] = new Array(values.length);
  let offset = 0;
  let shift = 0; // original length minus read length of the long runs passed so far
  let nextRun = 0;
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    offset += spaces[i].length;
    if (!read.startsWith(value, offset)) {
      // wink-nlp keeps values verbatim; should one ever differ, resynchronise on the text.
      const found = read.indexOf(value, offset);
      if (found >= 0) offset = found;
    }
    let start = offset + shift;
    let end = Math.min(text.length, start + value.length);
    let kind = KIND[types[i]] ?? 'other';
    const run = runs[nextRun];
    if (run && offset === run.at) {
      start = run.start;
      end = run.end;
      shift += run.end - run.start - 1;
      kind = /^[\p{L}\p{M}'’-]+$/u.test(text.slice(start, Math.min(end, start + 1000))) ? 'word' : 'other';
      nextRun++;
    }
    offset += value.length;
    const tokenText = end - start === value.length ? value : text.slice(start, end);
    const lower = tokenText.toLowerCase();
    const clitic = kind === 'word' && (lower.includes("'") || lower.includes('’')) && CLITIC.test(lower);
    tokens[i] = { start, end, text: tokenText, lower, kind, sentence: 0, negated: false, cue: false, clitic, stop: false, stem: '', syllables: 0, facts: null };
  }
  const wordTokens: Token[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    if (t.clitic) {
      t.stop = true;
      continue;
    }
    if (t.kind === 'number') {
      t.syllables = 1;
      t.facts = wordFacts(t.lower);
      wordTokens.push(t);
    } else if (t.kind === 'word') {
      const next = tokens[i + 1];
      const surface = next?.clitic && next.start === t.end ? t.lower + next.lower : t.lower;
      if (surface.length > 64) {
        t.stem = surface;
        t.syllables = syllablesOf(surface);
      } else {
        const facts = wordFacts(surface, t.lower);
        t.facts = facts;
        t.stem = facts.stem;
        t.syllables = facts.syllables;
        t.stop = facts.stop;
      }
      wordTokens.push(t);
    }
  }

  const sentences: Sentence[] = [];
  for (const [spanFirst, spanLast] of spans) {
    if (spanFirst > spanLast || spanFirst >= tokens.length) continue;
    // a sentence's character range leaves out line breaks and tabs at its edges
    let first = spanFirst;
    let last = Math.min(spanLast, tokens.length - 1);
    while (first < last && tokens[first].kind === 'space') first++;
    while (last > first && tokens[last].kind === 'space') last--;
    const index = sentences.length;
    let words = 0;
    for (let i = spanFirst; i <= Math.min(spanLast, tokens.length - 1); i++) {
      tokens[i].sentence = index;
      if (isWord(tokens[i])) words++;
    }
    sentences.push({ index, start: tokens[first].start, end: tokens[last].end, firstToken: first, endToken: last + 1, words });
  }

  const words = matchWords(text, tokens);
  const cues = findNegation(tokens, words, sentences, winkNegated);
  const doc: Doc = { text, tokens, wordTokens, sentences, words, cues, quantities: [], context };
  doc.quantities = findQuantities(doc);
  return doc;
}

const codes = (chars: string) => new Set([...chars].map((c) => c.charCodeAt(0)));
const EDGE_START_CODES = codes('"“”‘([{.,;:!?\'’');
const EDGE_END_CODES = codes('"“”’)]}.,;:!?');

/** Is the character code a letter or digit of ASCII (never an edge: the common case, decided first)? */
function asciiAlphanumeric(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || (c >= 48 && c <= 57);
}

/** Characters left out at a word's start (punctuation, quotes, apostrophes, white space). */
function edgeStart(c: number): boolean {
  return !asciiAlphanumeric(c) && (EDGE_START_CODES.has(c) || isSpaceCode(c));
}

function edgeEnd(c: number): boolean {
  return !asciiAlphanumeric(c) && (EDGE_END_CODES.has(c) || isSpaceCode(c));
}

/** Groups tokens not separated by white space into words and normalises each (see `MatchWord`). */
function matchWords(text: string, tokens: Token[]): MatchWord[] {
  const words: MatchWord[] = [];
  let runStart = -1;
  const close = (last: number) => {
    if (runStart < 0) return;
    const first = runStart;
    runStart = -1;
    const from = tokens[first].start;
    const to = tokens[last].end;
    let start = from;
    let end = to;
    while (start < end && edgeStart(text.charCodeAt(start))) start++;
    while (end > start && edgeEnd(text.charCodeAt(end - 1))) end--;
    if (start >= end) return;
    const lower = first === last && start === from && end === to ? tokens[first].lower : text.slice(start, end).toLowerCase();
    const norm = lower.includes('’') ? lower.replace(/’/g, "'") : lower;
    words.push({ norm, head: norm.slice(0, 2), start, end, firstToken: first, lastToken: last, sentence: tokens[first].sentence });
  };
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    if (t.kind === 'space') {
      close(i - 1);
      continue;
    }
    if (runStart >= 0 && tokens[i - 1].end !== t.start) close(i - 1);
    if (runStart < 0) runStart = i;
  }
  close(tokens.length - 1);
  return words;
}

/** Runs of non-space characters at least this long are read as one token (see shieldLongRuns). */
const LONG_RUN = 200;

/**
 * wink-nlp's tokenizer takes time quadratic in a token's length, so a 1 MB "word" would take
 * minutes. Each run of LONG_RUN or more non-space characters is replaced by one letter before
 * wink reads the text; `runs` records where each was (in the read text) and what it spanned.
 */
function shieldLongRuns(text: string): { read: string; runs: { at: number; start: number; end: number }[] } {
  if (text.length < LONG_RUN) return { read: text, runs: [] };
  const runs: { at: number; start: number; end: number }[] = [];
  let read = '';
  let last = 0;
  let runFrom = 0;
  // one pass over the character codes: a run is broken by any white space character
  for (let i = 0; i <= text.length; i++) {
    if (i < text.length && !isSpaceCode(text.charCodeAt(i))) continue;
    if (i - runFrom >= LONG_RUN) {
      read += text.slice(last, runFrom);
      runs.push({ at: read.length, start: runFrom, end: i });
      read += 'x';
      last = i;
    }
    runFrom = i + 1;
  }
  return runs.length ? { read: read + text.slice(last), runs } : { read: text, runs };
}

/** The characters JavaScript's `\s` matches. */
function isSpaceCode(c: number): boolean {
  if (c < 128) return c === 32 || (c >= 9 && c <= 13);
  return c === 0xa0 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff;
}

/** Analyses a prompt and its responses once each, giving every response the others as siblings. */
export function analyzeItem(prompt: string, responses: string[]): { prompt: Doc; responses: Doc[] } {
  const promptDoc = analyze(prompt);
  const docs = responses.map((r) => analyze(r, { prompt: promptDoc }));
  for (const doc of docs) doc.context.siblings = docs.filter((d) => d !== doc);
  return { prompt: promptDoc, responses: docs };
}

const wholeStems = new WeakMap<Doc, string[]>();

/** Content stems of a token range: words that are not stop words, negation cues or clitics. */
export function contentStems(doc: Doc, from = 0, to = doc.tokens.length): string[] {
  const whole = from === 0 && to === doc.tokens.length;
  const cached = whole ? wholeStems.get(doc) : undefined;
  if (cached) return cached;
  const out: string[] = [];
  for (let i = from; i < to; i++) {
    const t = doc.tokens[i];
    if (t.kind === 'word' && !t.stop && !t.cue && !t.clitic && t.lower.length > 1) out.push(t.stem);
  }
  if (whole) wholeStems.set(doc, out);
  return out;
}
