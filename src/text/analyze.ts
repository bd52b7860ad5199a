import { syllablesOf } from './syllables.ts';
import { splitSentences } from './sentences.ts';
import { isSpaceCode, tokenize } from './tokenize.ts';
import { winkNegationFlags } from './wink-negation.ts';
import { numberSlot, trimWordFacts, wordFacts, type WordFacts } from './word-facts.ts';
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
  /** For words and numbers (clitics aside): equal within a document exactly when `lower` is equal, numbered from 0 (`Doc.wordKinds`); −1 otherwise. */
  wordId: number;
  /** Likewise for `stem` (for a number: the number itself; `Doc.stemKinds`); −1 where `wordId` is. */
  stemId: number;
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
  /** How many distinct `Token.wordId`s and `Token.stemId`s the document has. */
  wordKinds: number;
  stemKinds: number;
  sentences: Sentence[];
  /** Words for phrase matching (see `MatchWord`). */
  words: MatchWord[];
  cues: NegationCue[];
  quantities: Quantity[];
  context: AnalysisContext;
}

/** True for tokens that count as words in readability and content measures. */
export function isWord(token: Token): boolean {
  return (token.kind === 'word' || token.kind === 'number') && !token.clitic;
}

/** `numberSlot` for strings without a slot: their numbers kept in a map of the document's own. */
function numberKey(numbers: Map<string, number>, key: string, counter: { next: number }): number {
  let id = numbers.get(key);
  if (id === undefined) numbers.set(key, (id = counter.next++));
  return id;
}

/** Numbers the documents analysed, for `numberSlot`. */
let documentSerial = 0;

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
  const tokens = tokenize(text);
  const wordTokens: Token[] = [];
  trimWordFacts();
  const serial = ++documentSerial;
  const words = { next: 0 };
  const stems = { next: 0 };
  // forms over 64 characters get no facts (nor slots): numbered through maps of their own
  let longWords: Map<string, number> | undefined;
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    if (t.clitic) continue;
    if (t.kind === 'number') {
      const facts = wordFacts(t.lower);
      t.syllables = 1;
      t.facts = facts;
      t.wordId = numberSlot(facts.wordSlot, serial, words);
      t.stemId = numberSlot(facts.stemSlot, serial, stems);
      wordTokens.push(t);
    } else if (t.kind === 'word') {
      const next = tokens[i + 1];
      const surface = next?.clitic && next.start === t.end ? t.lower + next.lower : t.lower;
      if (surface.length > 64) {
        t.stem = surface;
        t.syllables = syllablesOf(surface);
        longWords ??= new Map();
        t.wordId = numberKey(longWords, `w${t.lower}`, words);
        t.stemId = numberKey(longWords, `s${surface}`, stems);
      } else {
        const facts = wordFacts(surface, t.lower);
        t.facts = facts;
        t.stem = facts.stem;
        t.syllables = facts.syllables;
        t.stop = facts.stop;
        t.wordId = numberSlot(facts.wordSlot, serial, words);
        t.stemId = numberSlot(facts.stemSlot, serial, stems);
      }
      wordTokens.push(t);
    }
  }

  const sentences: Sentence[] = [];
  for (const [spanFirst, spanEnd] of splitSentences(text, tokens)) {
    // a sentence's character range leaves out line breaks and tabs at its edges
    let first = spanFirst;
    let last = spanEnd - 1;
    while (first < last && tokens[first].kind === 'space') first++;
    while (last > first && tokens[last].kind === 'space') last--;
    if (tokens[first].kind === 'space') {
      for (let i = spanFirst; i < spanEnd; i++) tokens[i].sentence = Math.max(0, sentences.length - 1);
      continue;
    }
    const index = sentences.length;
    let words = 0;
    for (let i = spanFirst; i < spanEnd; i++) {
      tokens[i].sentence = index;
      if (isWord(tokens[i])) words++;
    }
    sentences.push({ index, start: tokens[first].start, end: tokens[last].end, firstToken: first, endToken: last + 1, words });
  }

  const matches = matchWords(text, tokens);
  const cues = findNegation(tokens, matches, sentences, (open) => winkNegationFlags(text, tokens, open));
  const doc: Doc = { text, tokens, wordTokens, wordKinds: words.next, stemKinds: stems.next, sentences, words: matches, cues, quantities: [], context };
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

class MatchWordRecord implements MatchWord {
  constructor(public norm: string, public start: number, public end: number, public firstToken: number, public lastToken: number, public sentence: number) {}
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
    words.push(new MatchWordRecord(norm, start, end, first, last, tokens[first].sentence));
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

/** Analyses a prompt and its responses once each, giving every response the others as siblings. */
export function analyzeItem(prompt: string, responses: string[]): { prompt: Doc; responses: Doc[] } {
  const promptDoc = analyze(prompt);
  const docs = responses.map((r) => analyze(r, { prompt: promptDoc }));
  for (const doc of docs) doc.context.siblings = docs.filter((d) => d !== doc);
  return { prompt: promptDoc, responses: docs };
}

/** The whole document's content stems, kept on the document (not in a weak map: see phrase-index.ts). */
const WHOLE_STEMS = Symbol('content stems');

/** Content stems of a token range: words that are not stop words, negation cues or clitics. */
export function contentStems(doc: Doc, from = 0, to = doc.tokens.length): string[] {
  const whole = from === 0 && to === doc.tokens.length;
  const holder = doc as Doc & { [WHOLE_STEMS]?: string[] };
  const cached = whole ? holder[WHOLE_STEMS] : undefined;
  if (cached) return cached;
  const out: string[] = [];
  for (let i = from; i < to; i++) {
    const t = doc.tokens[i];
    if (t.kind === 'word' && !t.stop && !t.cue && !t.clitic && t.lower.length > 1) out.push(t.stem);
  }
  if (whole) holder[WHOLE_STEMS] = out;
  return out;
}
