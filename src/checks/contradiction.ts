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
  /** Its distinct content stems, as ids local to the document, in order of first use. */
  stems: number[];
  /** Ids of stems negated somewhere in it (usually none). */
  negatedStems: number[];
  /** Its words that have an antonym in ANTONYM_PAIRS. */
  antonymWords: Set<string>;
  conditional: boolean;
  quantities: Quantity[];
}

/** Shared by every sentence with no antonym: most sentences. */
const NO_WORDS: Set<string> = new Set();

/** Reads each sentence's facts; content stems go by the document's stem ids (`Token.stemId`). */
function allFacts(doc: Doc, quantities: Map<number, Quantity[]>): SentenceFacts[] {
  const seenIn = new Int32Array(doc.stemKinds); // by stem id: 1 + the sentence that last used it
  const all = doc.sentences.map((s) => {
    const stems: number[] = [];
    const negatedStems: number[] = [];
    let antonymWords = NO_WORDS;
    let conditional = false;
    for (let i = s.firstToken; i < s.endToken; i++) {
      const t = doc.tokens[i];
      if (t.kind !== 'word' || t.clitic) continue;
      if (CONDITIONAL.has(t.lower)) conditional = true;
      if (ANTONYMS.has(t.lower)) {
        if (antonymWords === NO_WORDS) antonymWords = new Set();
        antonymWords.add(t.lower);
        continue;
      }
      if (t.stop || t.cue || t.lower.length < 2) continue;
      const id = t.stemId;
      if (seenIn[id] !== s.index + 1) {
        seenIn[id] = s.index + 1;
        stems.push(id);
      }
      if (t.negated) negatedStems.push(id);
    }
    return { sentence: s, stems, negatedStems, antonymWords, conditional, quantities: quantities.get(s.index) ?? [] };
  });
  return all;
}

function antonymSwap(a: SentenceFacts, b: SentenceFacts): string | null {
  for (const w of a.antonymWords) {
    for (const o of ANTONYMS.get(w)!) if (b.antonymWords.has(o) && !a.antonymWords.has(o) && !b.antonymWords.has(w)) return `${w}/${o}`;
  }
  return null;
}

/**
 * Is a stem the two sentences share through the index (one in no more than MAX_POSTING
 * sentences) negated in one only? `inA` marks the stems of `a` with `stamp`.
 */
function polarityFlip(a: SentenceFacts, b: SentenceFacts, postings: number[][], inA: Int32Array, stamp: number): boolean {
  if (!a.negatedStems.length && !b.negatedStems.length) return false;
  for (const id of a.stems) inA[id] = stamp;
  for (const id of b.stems) {
    if (inA[id] !== stamp || postings[id].length > MAX_POSTING) continue;
    if (a.negatedStems.includes(id) !== b.negatedStems.includes(id)) return true;
  }
  return false;
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
    const all = allFacts(doc, bySentence);
    const postings: number[][] = new Array(doc.stemKinds); // by stem id: the sentences holding it
    const inA = new Int32Array(doc.stemKinds);
    let stamp = 0;
    const sharedCount = new Int32Array(all.length);
    const touched: number[] = [];
    let pairsCompared = 0;
    let found = 0;
    for (const b of all) {
      for (const id of b.stems) {
        const posting = postings[id];
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
        const flip = polarityFlip(a, b, postings, inA, ++stamp);
        if (flip !== Boolean(swap)) {
          if (flip) report('negation', b.sentence, undefined, a.sentence);
          else report('antonym', b.sentence, { pair: swap! }, a.sentence);
          found++;
          break;
        }
      }
      for (const j of touched) sharedCount[j] = 0;
      touched.length = 0;
      for (const id of b.stems) {
        const posting = postings[id];
        if (posting) posting.push(b.sentence.index);
        else postings[id] = [b.sentence.index];
      }
    }
    return { metrics: { contradictions: found, sentence_pairs_compared: pairsCompared }, value: 1 - 0.5 * found };
  },
});
