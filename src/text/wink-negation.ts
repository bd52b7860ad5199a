import { isSpaceCode } from './tokenize.ts';
import { winkReader } from './wink-reader.ts';

interface Span {
  start: number;
  end: number;
}

interface TokenLike extends Span {
  lower: string;
}

interface SentenceLike extends Span {
  firstToken: number;
  endToken: number;
}

/**
 * Words that open one of wink-nlp's negation patterns (read from the start state of the
 * negation model in wink-eng-lite-web-model; "may", "might" and "go" open patterns only with
 * "not" or "no" after them, "cause" only pseudo-negations). A sentence without one of these
 * gets no negation flag from wink-nlp, so it need not be read.
 */
const WINK_TRIGGERS = new Set(['eliminate', 'fail', 'failed', 'failing', 'fails', 'hardly', 'impossible', 'neither', 'never', 'no', 'none', 'nor', 'not', "n't", 'n’t', 'prevent', 'rarely', 'rule', 'ruled', 'rules', 'scarcely', 'unlikely', 'without']);
/** "as good as", "as long as", "as much as", "as soon as" */
const AS_TRIGGERS = new Set(['good', 'long', 'much', 'soon']);

/** Between sentences read together: wink-nlp always ends a sentence at a blank line. */
const SEPARATOR = '\n\n';

/**
 * wink-nlp's negation flags, one per token of ours: true where wink-nlp marks a token of the
 * same characters as negated. Only sentences holding a word that can open a wink-nlp negation
 * pattern are read (pipe `['sbd', 'negation']`), all in one read, separated by blank lines; if
 * wink-nlp should join two of them into one sentence, each is read on its own instead, so a
 * scope never runs from one sentence into the next. Flags are carried over by character
 * offsets, so the two tokenizations need not agree.
 */
export function winkNegationFlags(text: string, tokens: TokenLike[], sentences: SentenceLike[]): boolean[] {
  const flags = new Array<boolean>(tokens.length).fill(false);
  const chosen = sentences.filter((sentence) => hasTrigger(tokens, sentence));
  if (chosen.length > 1 && readTogether(text, tokens, chosen, flags)) return flags;
  for (const sentence of chosen) readTogether(text, tokens, [sentence], flags);
  return flags;
}

/**
 * Reads the sentences in one wink-nlp document and sets the flags of our tokens under each
 * negated wink-nlp token; returns false, setting nothing, if wink-nlp joins any of them.
 */
function readTogether(text: string, tokens: TokenLike[], chosen: SentenceLike[], flags: boolean[]): boolean {
  const pieces = chosen.map((s) => shieldLongRuns(text.slice(s.start, s.end)));
  const read = pieces.length === 1 ? pieces[0].read : pieces.map((p) => p.read).join(SEPARATOR);
  const nlp = winkReader();
  const wdoc = nlp.readDoc(read);
  if (wdoc.sentences().length() < chosen.length) return false;
  const values = wdoc.tokens().out(nlp.its.value) as string[];
  const spaces = wdoc.tokens().out(nlp.its.precedingSpaces) as string[];
  const negated = wdoc.tokens().out(nlp.its.negationFlag) as unknown as boolean[];
  let piece = 0;
  let pieceAt = 0; // where the current piece starts in the read text
  let offset = 0;
  let mine = chosen[0].firstToken;
  for (let w = 0; w < values.length; w++) {
    offset += spaces[w].length;
    if (!read.startsWith(values[w], offset)) {
      // wink-nlp keeps values verbatim; should one ever differ, resynchronise on the text
      const found = read.indexOf(values[w], offset);
      if (found >= 0) offset = found;
    }
    while (piece + 1 < pieces.length && offset >= pieceAt + pieces[piece].read.length + SEPARATOR.length) {
      pieceAt += pieces[piece].read.length + SEPARATOR.length;
      piece++;
      mine = chosen[piece].firstToken;
    }
    const valueStart = offset;
    offset += values[w].length;
    if (!negated[w] || offset - pieceAt > pieces[piece].read.length) continue;
    const sentence = chosen[piece];
    const start = sentence.start + original(pieces[piece].runs, valueStart - pieceAt);
    const end = sentence.start + original(pieces[piece].runs, offset - pieceAt);
    while (mine < sentence.endToken && tokens[mine].end <= start) mine++;
    for (let k = mine; k < sentence.endToken && tokens[k].start < end; k++) flags[k] = true;
  }
  return true;
}

function hasTrigger(tokens: TokenLike[], sentence: SentenceLike): boolean {
  for (let i = sentence.firstToken; i < sentence.endToken; i++) {
    const lower = tokens[i].lower;
    if (WINK_TRIGGERS.has(lower)) return true;
    if (lower === 'as' && AS_TRIGGERS.has(tokens[i + 1]?.lower ?? '')) return true;
  }
  return false;
}

interface Run {
  /** Offset in the read text of the letter that stands for the run. */
  at: number;
  start: number;
  end: number;
}

/** The offset in the original text of an offset in the read text (see shieldLongRuns). */
function original(runs: Run[], offset: number): number {
  let shift = 0;
  for (const run of runs) {
    if (offset <= run.at) break;
    shift += run.end - run.start - 1;
  }
  return offset + shift;
}

/** Runs of non-space characters at least this long are read as one letter (see shieldLongRuns). */
const LONG_RUN = 200;

/**
 * wink-nlp's tokenizer takes time quadratic in a token's length, so a 1 MB "word" would take
 * minutes. Each run of LONG_RUN or more non-space characters is replaced by one letter before
 * wink-nlp reads the text; `runs` records where each was (in the read text) and what it spanned.
 */
function shieldLongRuns(text: string): { read: string; runs: Run[] } {
  if (text.length < LONG_RUN) return { read: text, runs: [] };
  const runs: Run[] = [];
  let read = '';
  let last = 0;
  let runFrom = 0;
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
