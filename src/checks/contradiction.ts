import { type Doc, type Sentence } from '../text/analyze.ts';
import type { Quantity } from '../text/quantities.ts';
import { defineCheck } from './define-check.ts';

/** Antonym pairs (our own list of common ones); either word may stand for the first or second. */
const ANTONYM_PAIRS: [string, string][] = [
  ['safe', 'unsafe'], ['safe', 'dangerous'], ['safe', 'harmful'], ['harmless', 'harmful'], ['inside', 'outside'],
  ['indoors', 'outdoors'], ['hot', 'cold'], ['warm', 'cold'], ['open', 'closed'], ['wet', 'dry'], ['increase', 'decrease'],
  ['before', 'after'], ['allowed', 'forbidden'], ['allowed', 'prohibited'], ['allowed', 'banned'], ['permitted', 'prohibited'],
  ['edible', 'poisonous'], ['edible', 'toxic'], ['true', 'false'], ['legal', 'illegal'], ['higher', 'lower'],
  ['more', 'less'], ['high', 'low'], ['summer', 'winter'], ['day', 'night'], ['full', 'empty'], ['adult', 'child'], ['adults', 'children'], ['tight', 'loose'], ['tightly', 'loosely'], ['clean', 'dirty'], ['effective', 'ineffective'],
  ['possible', 'impossible'], ['necessary', 'unnecessary'], ['enough', 'insufficient'], ['fast', 'slow'],
];
const ANTONYMS = new Map<string, Set<string>>();
for (const [a, b] of ANTONYM_PAIRS) {
  if (!ANTONYMS.has(a)) ANTONYMS.set(a, new Set());
  if (!ANTONYMS.has(b)) ANTONYMS.set(b, new Set());
  ANTONYMS.get(a)!.add(b);
  ANTONYMS.get(b)!.add(a);
}

/** Words that make a statement conditional or contrastive; such sentences are not compared. */
const CONDITIONAL = new Set(['if', 'unless', 'when', 'whenever', 'otherwise', 'except', 'above', 'below', 'over', 'under', 'until', 'after', 'before', 'but', 'however', 'instead', 'or']);

interface SentenceFacts {
  sentence: Sentence;
  stems: Set<string>;
  negatedStems: Set<string>;
  /** Its words that have an antonym in ANTONYM_PAIRS. */
  antonymWords: Set<string>;
  conditional: boolean;
  quantities: Quantity[];
}

/** Shared by every sentence with no negated stem or no antonym: most sentences. */
const NONE: Set<string> = new Set();

function facts(doc: Doc, s: Sentence, quantities: Quantity[]): SentenceFacts {
  const stems = new Set<string>();
  let negatedStems = NONE;
  let antonymWords = NONE;
  let conditional = false;
  for (let i = s.firstToken; i < s.endToken; i++) {
    const t = doc.tokens[i];
    if (t.kind !== 'word' || t.clitic) continue;
    if (CONDITIONAL.has(t.lower)) conditional = true;
    if (ANTONYMS.has(t.lower)) {
      if (antonymWords === NONE) antonymWords = new Set();
      antonymWords.add(t.lower);
      continue;
    }
    if (t.stop || t.cue || t.lower.length < 2) continue;
    stems.add(t.stem);
    if (t.negated) {
      if (negatedStems === NONE) negatedStems = new Set();
      negatedStems.add(t.stem);
    }
  }
  return { sentence: s, stems, negatedStems, antonymWords, conditional, quantities };
}

function antonymSwap(a: SentenceFacts, b: SentenceFacts): string | null {
  for (const w of a.antonymWords) {
    for (const o of ANTONYMS.get(w)!) if (b.antonymWords.has(o) && !a.antonymWords.has(o) && !b.antonymWords.has(w)) return `${w}/${o}`;
  }
  return null;
}

/** Is a stem the two sentences share (through the index) negated in one only? */
function polarityFlip(a: SentenceFacts, b: SentenceFacts, index: Map<string, number[]>): boolean {
  if (a.negatedStems === NONE && b.negatedStems === NONE) return false;
  for (const stem of b.stems) {
    if (!a.stems.has(stem) || !sharedThrough(index, stem)) continue;
    if (a.negatedStems.has(stem) !== b.negatedStems.has(stem)) return true;
  }
  return false;
}

/** Does a stem link sentences in the index (it is there, and in no more than MAX_POSTING of them)? */
function sharedThrough(index: Map<string, number[]>, stem: string): boolean {
  const posting = index.get(stem);
  return posting !== undefined && posting.length <= MAX_POSTING;
}

function numberClash(a: SentenceFacts, b: SentenceFacts): [Quantity, Quantity] | null {
  for (const qa of a.quantities) {
    for (const qb of b.quantities) {
      if (qa.family !== qb.family) continue;
      if (qa.baseHigh < qb.base * 0.99 || qb.baseHigh < qa.base * 0.99) return [qa, qb];
    }
  }
  return null;
}

/** Stems found in more sentences than this say little about what a sentence is about. */
const MAX_POSTING = 50;

/**
 * Self-contradiction: two sentences about the same thing (sharing content stems) where the
 * polarity flips (a shared word negated in one only), an antonym swaps, or a quantity of the same
 * kind differs — following the tractable contradiction types of de Marneffe, Rafferty & Manning
 * (2008). A negation flip together with an antonym swap agrees ("never inside" / "outside").
 * Conditional or contrastive sentences ("if", "unless", "above 2,000 m") are left alone.
 * Pairs come from an index of stems to sentences, so unrelated sentences are never compared.
 */
export const contradiction = defineCheck<{ minShared: number }>({
  meta: {
    id: 'contradiction',
    description: 'Sentences in one response that contradict each other: a negation flips, an antonym swaps, or a number differs in the same context.',
    params: {
      minShared: { type: 'integer', default: 2, min: 1, max: 10, description: 'Content stems two sentences must share to be about the same thing.' },
    },
    messages: {
      negation: 'says the opposite of an earlier sentence (one of them is negated)',
      antonym: 'contradicts an earlier sentence ({pair})',
      number: 'gives {later} where an earlier sentence gives {earlier}',
    },
  },
  evaluate(doc, params, report) {
    const bySentence = new Map<number, Quantity[]>();
    for (const q of doc.quantities) {
      if (!q.family) continue;
      const list = bySentence.get(q.sentence);
      if (list) list.push(q);
      else bySentence.set(q.sentence, [q]);
    }
    const all = doc.sentences.map((s) => facts(doc, s, bySentence.get(s.index) ?? []));
    const index = new Map<string, number[]>();
    const sharedCount = new Int32Array(all.length);
    const touched: number[] = [];
    let pairsCompared = 0;
    let found = 0;
    for (const b of all) {
      for (const stem of b.stems) {
        const posting = index.get(stem);
        if (!posting || posting.length > MAX_POSTING) continue;
        for (const j of posting) if (sharedCount[j]++ === 0) touched.push(j);
      }
      for (const j of touched) {
        const shared = sharedCount[j];
        if (shared < params.minShared) continue;
        const a = all[j];
        pairsCompared++;
        if (a.conditional || b.conditional) continue;
        const swap = antonymSwap(a, b);
        const clash = numberClash(a, b);
        // different numbers under opposite conditions ("4 hours on high", "40 hours on low") agree
        if (swap && clash) continue;
        if (clash) {
          report('number', b.sentence, { later: clash[1].text, earlier: clash[0].text }, a.sentence);
          found++;
          break;
        }
        const flip = polarityFlip(a, b, index);
        if (flip !== Boolean(swap)) {
          if (flip) report('negation', b.sentence, undefined, a.sentence);
          else report('antonym', b.sentence, { pair: swap! }, a.sentence);
          found++;
          break;
        }
      }
      for (const j of touched) sharedCount[j] = 0;
      touched.length = 0;
      for (const stem of b.stems) {
        const posting = index.get(stem);
        if (posting) posting.push(b.sentence.index);
        else index.set(stem, [b.sentence.index]);
      }
    }
    return { metrics: { contradictions: found, sentence_pairs_compared: pairsCompared }, value: 1 - 0.5 * found };
  },
});
