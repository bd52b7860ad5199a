import type { MatchWord, Sentence, Token } from './analyze.ts';
import { PhraseIndex } from './phrase-index.ts';
import { NEGATION_TERMINATORS, POST_NEGATION_CUES, PRE_NEGATION_CUES, PSEUDO_NEGATIONS } from './word-lists.ts';

/** A negation cue found in the text and the character range it negates. */
export interface NegationCue {
  start: number;
  end: number;
  text: string;
  direction: 'pre' | 'post';
  scopeStart: number;
  scopeEnd: number;
}

/** Words a scope reaches at most (NegEx used a window of about five; clauses run longer). */
const MAX_SCOPE_WORDS = 8;

const PRE = new PhraseIndex(PRE_NEGATION_CUES.filter((c) => c !== "n't"));
const POST = new PhraseIndex(POST_NEGATION_CUES);
const PSEUDO = new PhraseIndex([...PSEUDO_NEGATIONS, ...PSEUDO_NEGATIONS.filter((p) => p.includes("n't")).map((p) => p.replace("n't", ' not'))]);

function endsScope(t: Token): boolean {
  return t.kind === 'punctuation' || NEGATION_TERMINATORS.has(t.lower);
}

/** The token range [first, last] a span of words covers. */
function tokensOf(words: MatchWord[], a: number, b: number): [number, number] {
  return [words[a].firstToken, words[b].lastToken];
}

/** wink-nlp's negation flags (one per token) for the given sentences; tokens elsewhere are false. */
export type WinkFlagReader = (sentences: Sentence[]) => boolean[];

/**
 * Marks negation cues and their scope on `tokens` (sets `cue` and `negated`) and returns the
 * cues. NegEx-style lists decide what is a cue; pseudo-negations ("not only", "can't stress")
 * are no cues; a scope ends at a termination term, punctuation, the sentence's end or after
 * eight words. wink-nlp's own negation flags extend a scope only where no termination term or
 * pseudo-negation intervenes, so both readings agree on what counts. wink-nlp is asked only
 * about the sentences where its flags can change the outcome: those with a token after a cue,
 * before anything that blocks, that the NegEx scope left out.
 */
export function findNegation(tokens: Token[], words: MatchWord[], sentences: Sentence[], readWinkFlags: WinkFlagReader): NegationCue[] {
  const cues: NegationCue[] = [];
  const pseudo = new Set<number>();
  for (const [a, b] of PSEUDO.matchWords(words)) {
    const [first, last] = tokensOf(words, a, b);
    for (let i = first; i <= last; i++) pseudo.add(i);
  }
  const pre = PRE.matchWords(words).map(([a, b]) => tokensOf(words, a, b));
  for (const w of words) {
    // a contraction's "n't" negates: the cue is its last token
    if (w.norm.endsWith("n't") && tokens[w.lastToken].clitic) pre.push([w.lastToken, w.lastToken]);
  }
  for (const [first, last] of pre) {
    if (pseudo.has(first) || pseudo.has(last)) continue;
    const sentence = sentences[tokens[first].sentence];
    if (!sentence) continue;
    for (let i = first; i <= last; i++) tokens[i].cue = true;
    let count = 0;
    let scopeLast = last;
    for (let i = last + 1; i < sentence.endToken && count < MAX_SCOPE_WORDS; i++) {
      if (endsScope(tokens[i]) && !(tokens[i].lower === 'and' && count === 0)) break;
      tokens[i].negated = true;
      scopeLast = i;
      if (tokens[i].kind === 'word' || tokens[i].kind === 'number') count++;
    }
    const cueStart = tokens[first].start;
    cues.push({ start: cueStart, end: tokens[last].end, text: textOf(tokens, first, last), direction: 'pre', scopeStart: tokens[Math.min(last + 1, scopeLast)].start, scopeEnd: tokens[scopeLast].end });
  }
  for (const [a, b] of POST.matchWords(words)) {
    const [first, last] = tokensOf(words, a, b);
    const sentence = sentences[tokens[first].sentence];
    if (!sentence) continue;
    for (let i = first; i <= last; i++) tokens[i].cue = true;
    let count = 0;
    let scopeFirst = first;
    for (let i = first - 1; i >= sentence.firstToken && count < MAX_SCOPE_WORDS; i--) {
      if (endsScope(tokens[i])) break;
      tokens[i].negated = true;
      scopeFirst = i;
      if (tokens[i].kind === 'word' || tokens[i].kind === 'number') count++;
    }
    cues.push({ start: tokens[first].start, end: tokens[last].end, text: textOf(tokens, first, last), direction: 'post', scopeStart: tokens[scopeFirst].start, scopeEnd: tokens[Math.max(scopeFirst, first - 1)].end });
  }
  // wink-nlp's flags: kept unless a pseudo-negation or termination term came first.
  const open = sentences.filter((sentence) => reachAfterCues(tokens, sentence, pseudo, (t) => !t.negated));
  if (open.length) {
    const winkNegated = readWinkFlags(open);
    for (const sentence of open) {
      reachAfterCues(tokens, sentence, pseudo, (t, i) => {
        if (winkNegated[i]) t.negated = true;
      });
    }
  }
  return cues.sort((x, y) => x.start - y.start);
}

/**
 * Visits the tokens of a sentence that wink-nlp's flags may negate: those after a cue with no
 * termination term, punctuation or pseudo-negation between. Stops, returning true, as soon as
 * `visit` returns true.
 */
function reachAfterCues(tokens: Token[], sentence: Sentence, pseudo: Set<number>, visit: (t: Token, i: number) => boolean | void): boolean {
  let blocked = true;
  for (let i = sentence.firstToken; i < sentence.endToken; i++) {
    const t = tokens[i];
    if (t.cue) blocked = false;
    else if (pseudo.has(i) || endsScope(t)) blocked = true;
    else if (!blocked && visit(t, i)) return true;
  }
  return false;
}

function textOf(tokens: Token[], first: number, last: number): string {
  return tokens
    .slice(first, last + 1)
    .map((t) => t.text)
    .join(' ');
}
