import type { Sentence, Token } from './analyze.ts';
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

function phraseRegex(phrases: readonly string[]): RegExp {
  const alternatives = [...phrases]
    .sort((a, b) => b.length - a.length)
    .map((p) => p.replace(/[.*+?^${}()|[\]\\]/g, '\\$&').replace(/ /g, ' +'));
  return new RegExp(`(?<![\\p{L}\\p{N}'’])(?:${alternatives.join('|')})(?![\\p{L}\\p{N}])`, 'gu');
}

const PRE = phraseRegex(PRE_NEGATION_CUES.filter((c) => c !== "n't"));
const POST = phraseRegex(POST_NEGATION_CUES);
const PSEUDO = phraseRegex([...PSEUDO_NEGATIONS, ...PSEUDO_NEGATIONS.filter((p) => p.includes("n't")).map((p) => p.replace("n't", ' not'))]);

/**
 * The sentence as lowercase words joined by single spaces (a contraction's tail glued to its
 * word, so "ca" + "n't" reads "can't"), with the token index of every character.
 */
function normalise(tokens: Token[], sentence: Sentence): { norm: string; owner: number[] } {
  let norm = '';
  const owner: number[] = [];
  for (let i = sentence.firstToken; i < sentence.endToken; i++) {
    const t = tokens[i];
    if (t.kind === 'space') continue;
    if (norm && !t.clitic) {
      norm += ' ';
      owner.push(i);
    }
    const lower = t.lower.replace(/’/g, "'");
    norm += lower;
    for (let k = 0; k < lower.length; k++) owner.push(i);
  }
  return { norm, owner };
}

function tokenRanges(regex: RegExp, norm: string, owner: number[]): [number, number][] {
  const out: [number, number][] = [];
  regex.lastIndex = 0;
  for (const m of norm.matchAll(regex)) out.push([owner[m.index!], owner[m.index! + m[0].length - 1] + 1]);
  return out;
}

function endsScope(t: Token): boolean {
  return t.kind === 'punctuation' || NEGATION_TERMINATORS.has(t.lower);
}

/**
 * Marks negation cues and their scope on `tokens` (sets `cue` and `negated`) and returns the
 * cues. NegEx-style lists decide what is a cue; pseudo-negations ("not only", "can't stress")
 * are no cues; a scope ends at a termination term, punctuation, the sentence's end or after
 * eight words. wink-nlp's own negation flags extend a scope only where no termination term or
 * pseudo-negation intervenes, so both readings agree on what counts.
 */
export function findNegation(tokens: Token[], sentences: Sentence[], winkNegated: boolean[]): NegationCue[] {
  const cues: NegationCue[] = [];
  for (const sentence of sentences) {
    const { norm, owner } = normalise(tokens, sentence);
    const pseudo = new Set<number>();
    for (const [a, b] of tokenRanges(PSEUDO, norm, owner)) for (let i = a; i < b; i++) pseudo.add(i);

    const pre: [number, number][] = tokenRanges(PRE, norm, owner);
    for (let i = sentence.firstToken; i < sentence.endToken; i++) {
      if (tokens[i].clitic && /^n['’]t$/.test(tokens[i].lower)) pre.push([i, i + 1]);
    }
    for (const [a, b] of pre) {
      if (pseudo.has(a) || pseudo.has(b - 1)) continue;
      for (let i = a; i < b; i++) tokens[i].cue = true;
      let words = 0;
      let last = b - 1;
      for (let i = b; i < sentence.endToken && words < MAX_SCOPE_WORDS; i++) {
        if (endsScope(tokens[i]) && !(tokens[i].lower === 'and' && words === 0)) break;
        tokens[i].negated = true;
        last = i;
        if (tokens[i].kind === 'word' || tokens[i].kind === 'number') words++;
      }
      cues.push({ start: tokens[a].start, end: tokens[b - 1].end, text: tokens[a].text === '' ? '' : joinText(tokens, a, b), direction: 'pre', scopeStart: tokens[Math.min(b, last)].start, scopeEnd: tokens[last].end });
    }

    for (const [a, b] of tokenRanges(POST, norm, owner)) {
      for (let i = a; i < b; i++) tokens[i].cue = true;
      let words = 0;
      let first = a;
      for (let i = a - 1; i >= sentence.firstToken && words < MAX_SCOPE_WORDS; i--) {
        if (endsScope(tokens[i])) break;
        tokens[i].negated = true;
        first = i;
        if (tokens[i].kind === 'word' || tokens[i].kind === 'number') words++;
      }
      cues.push({ start: tokens[a].start, end: tokens[b - 1].end, text: joinText(tokens, a, b), direction: 'post', scopeStart: tokens[first].start, scopeEnd: tokens[Math.max(first, a - 1)].end });
    }

    // wink-nlp's flags: kept unless a pseudo-negation or termination term came first.
    let blocked = true;
    for (let i = sentence.firstToken; i < sentence.endToken; i++) {
      const t = tokens[i];
      if (t.cue) blocked = false;
      else if (pseudo.has(i) || endsScope(t)) blocked = true;
      else if (winkNegated[i] && !blocked) t.negated = true;
    }
  }
  return cues.sort((x, y) => x.start - y.start);
}

function joinText(tokens: Token[], a: number, b: number): string {
  return tokens[a].text.length && b > a ? `${tokens.slice(a, b).map((t) => t.text).join(' ')}` : '';
}
