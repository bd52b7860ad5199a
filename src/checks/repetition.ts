import { deflateRawSync } from 'node:zlib';
import type { Doc, Token } from '../text/analyze.ts';
import { defineCheck, type Report } from './define-check.ts';

interface Params {
  n: number;
  maxSeqRep: number;
  nearDuplicate: number;
  maxCompressionRatio: number;
  topShare2: number;
  topShare3: number;
  topShare4: number;
}

/**
 * Scratch space reused from one document to the next: the hash tables and counters below are
 * sized for the largest document seen so far and reset, not reallocated, for each new one.
 */
let scratch = new Int32Array(0);

function scratchOf(size: number): Int32Array {
  if (scratch.length < size) scratch = new Int32Array(Math.max(size, scratch.length * 2, 1024));
  return scratch;
}

/**
 * Dense ids for the n-grams of a text, for n = 1 … maxN: `levels[n][i]` is the id of the n-gram
 * starting at word i, equal n-grams get equal ids, and `distinct[n]` counts them. Each level is
 * built from the one before (id of the (n−1)-gram, next word), so keys stay small integers.
 */
function ngramIds(ws: Token[], wordKinds: number, maxN: number): { levels: Int32Array[]; distinct: number[] } {
  const first = new Int32Array(ws.length);
  for (let i = 0; i < ws.length; i++) first[i] = ws[i].wordId;
  const levels = [new Int32Array(0), first];
  const distinct = [0, wordKinds];
  for (let n = 2; n <= maxN; n++) {
    const previous = levels[n - 1];
    const count = Math.max(0, ws.length - n + 1);
    const ids = new Int32Array(count);
    pairIds.reset(count);
    for (let i = 0; i < count; i++) ids[i] = pairIds.idOf(previous[i], first[i + n - 1]);
    levels.push(ids);
    distinct.push(pairIds.size);
  }
  return { levels, distinct };
}

/**
 * Dense ids for pairs of small integers, in an open-addressing table sized for the pairs of one
 * document: the n-gram levels' inner loop, where a Map keyed by numbers would dominate the cost.
 * One table serves every document; `reset` empties it.
 */
class PairIds {
  private keysA = new Int32Array(0);
  private keysB = new Int32Array(0);
  private values = new Int32Array(0);
  private mask = 0;
  size = 0;

  reset(capacity: number): void {
    let slots = 16;
    while (slots < capacity * 2) slots *= 2;
    if (this.keysA.length < slots) {
      this.keysA = new Int32Array(slots);
      this.keysB = new Int32Array(slots);
      this.values = new Int32Array(slots);
    }
    this.keysA.fill(-1, 0, slots);
    this.mask = slots - 1;
    this.size = 0;
  }

  idOf(a: number, b: number): number {
    let slot = (Math.imul(a, 0x9e3779b1) ^ Math.imul(b, 0x85ebca6b)) & this.mask;
    for (;;) {
      const key = this.keysA[slot];
      if (key === -1) {
        this.keysA[slot] = a;
        this.keysB[slot] = b;
        this.values[slot] = this.size;
        return this.size++;
      }
      if (key === a && this.keysB[slot] === b) return this.values[slot];
      slot = (slot + 1) & this.mask;
    }
  }
}

const pairIds = new PairIds();

/** The most frequent id, where it occurs, and the share of word characters its occurrences cover (Rae et al. 2021). */
function mostFrequent(ids: Int32Array, distinct: number, ws: Token[], n: number, wordChars: number): { positions: number[]; share: number | null } {
  if (!ids.length || !wordChars) return { positions: [], share: null };
  const counts = scratchOf(distinct).fill(0, 0, distinct);
  let best = ids[0];
  for (const id of ids) if (++counts[id] > counts[best]) best = id;
  if (counts[best] < 2) return { positions: [], share: 0 };
  const positions: number[] = [];
  for (let i = 0; i < ids.length; i++) if (ids[i] === best) positions.push(i);
  let chars = 0;
  for (let k = 0; k < n; k++) chars += ws[positions[0] + k].text.length;
  return { positions, share: Math.min(1, (positions.length * chars) / wordChars) };
}

/** How many of the latest earlier sentences holding a shingle are compared through it. */
const MAX_CANDIDATES = 50;

/** Postings of the shingle index as linked lists in flat arrays, reused across documents. */
const postings = { head: new Int32Array(0), next: new Int32Array(0), sentence: new Int32Array(0), lastAdded: new Int32Array(0) };

function resetPostings(ids: number, entries: number): void {
  if (postings.head.length < ids) {
    postings.head = new Int32Array(ids * 2);
    postings.lastAdded = new Int32Array(ids * 2);
  }
  if (postings.next.length < entries) {
    postings.next = new Int32Array(entries * 2);
    postings.sentence = new Int32Array(entries * 2);
  }
  postings.head.fill(-1, 0, ids);
  postings.lastAdded.fill(0, 0, ids);
}

/**
 * Near-duplicate sentences: Jaccard similarity of word 3-gram shingles (a sentence under 3 words
 * is one shingle of its own), each sentence compared only with the latest earlier sentences
 * that share a shingle with it. Shingle ids are dense (from `ngramIds`), so the index, the
 * per-sentence sets and the shared counts are flat arrays rather than maps. Reports each repeat
 * and returns how many sentences repeat an earlier one.
 */
function nearDuplicates(doc: Doc, shingles: Int32Array, shingleIds: number, threshold: number, report: Report): number {
  const ws = doc.wordTokens;
  const sentenceCount = doc.sentences.length;
  // every shingle of a long sentence, plus one id per short sentence
  resetPostings(shingleIds + sentenceCount, shingles.length + sentenceCount);
  const { head, next, sentence: postedSentence, lastAdded } = postings;
  let posted = 0;
  const shortSentences = new Map<string, number>();
  const sizes = new Int32Array(sentenceCount);
  const shared = new Int32Array(sentenceCount);
  const touched: number[] = [];
  const own: number[] = [];
  let duplicates = 0;
  let w = 0;
  for (const s of doc.sentences) {
    const from = w;
    while (w < ws.length && ws[w].sentence === s.index) w++;
    own.length = 0;
    if (w - from >= 3) {
      for (let i = from; i <= w - 3; i++) {
        const id = shingles[i];
        if (lastAdded[id] !== s.index + 1) {
          lastAdded[id] = s.index + 1;
          own.push(id);
        }
      }
    } else if (w > from) {
      const key = ws.slice(from, w).map((x) => x.lower).join(' ');
      let id = shortSentences.get(key);
      if (id === undefined) shortSentences.set(key, (id = shingleIds + shortSentences.size));
      own.push(id);
    }
    sizes[s.index] = own.length;
    if (!own.length) continue;
    for (const id of own) {
      // latest first, at most MAX_CANDIDATES of them
      for (let p = head[id], k = 0; p >= 0 && k < MAX_CANDIDATES; p = next[p], k++) {
        const j = postedSentence[p];
        if (shared[j]++ === 0) touched.push(j);
      }
    }
    let best = -1;
    let bestSim = 0;
    for (const j of touched) {
      const sim = shared[j] / (own.length + sizes[j] - shared[j]);
      if (sim > bestSim || (sim === bestSim && j < best)) [best, bestSim] = [j, sim];
      shared[j] = 0;
    }
    touched.length = 0;
    if (best >= 0 && bestSim >= threshold) {
      duplicates++;
      report('repeated-sentence', s, { similarity: bestSim.toFixed(2) }, doc.sentences[best]);
    }
    for (const id of own) {
      postedSentence[posted] = s.index;
      next[posted] = head[id];
      head[id] = posted++;
    }
  }
  return duplicates;
}


/**
 * Repetition: seq-rep-n (Welleck et al. 2019), distinct-1 and distinct-2 (Li et al. 2016, over
 * all n-grams of that order), near-duplicate sentences (Jaccard similarity of word 3-gram
 * shingles, found through a shingle index rather than by comparing every pair), the deflate
 * compression ratio, and the share of word characters covered by the most frequent 2-, 3- and
 * 4-gram (Rae et al. 2021: 0.20, 0.18, 0.16).
 */
export const repetition = defineCheck<Params>({
  meta: {
    id: 'repetition',
    description: 'Repeated words, phrases and sentences: seq-rep-n, distinct-n, near-duplicate sentences, compression ratio and most-frequent n-gram share.',
    params: {
      n: { type: 'integer', default: 4, min: 1, max: 8, description: 'n of seq-rep-n.' },
      maxSeqRep: { type: 'number', default: 0.3, min: 0, max: 1, description: 'seq-rep-n above this is flagged.' },
      nearDuplicate: { type: 'number', default: 0.8, min: 0.1, max: 1, description: 'Shingle Jaccard similarity at which two sentences count as near-duplicates.' },
      maxCompressionRatio: { type: 'number', default: 2.4, min: 1, max: 20, description: 'Deflate ratio above this is flagged (common practice: 2.4).' },
      topShare2: { type: 'number', default: 0.2, min: 0, max: 1, description: 'Limit on the character share of the most frequent 2-gram (Rae et al. 2021).' },
      topShare3: { type: 'number', default: 0.18, min: 0, max: 1, description: 'Limit for 3-grams (Rae et al. 2021).' },
      topShare4: { type: 'number', default: 0.16, min: 0, max: 1, description: 'Limit for 4-grams (Rae et al. 2021).' },
    },
    messages: {
      'repeated-sentence': 'repeats an earlier sentence (similarity {similarity})',
      'repeated-phrase': '"{phrase}" appears {count} times and covers {share}% of the text',
      'high-seq-rep': '{percent}% of the {n}-word sequences repeat',
      'compressible': 'the text compresses {ratio}× — typical of repetitive text',
    },
  },
  evaluate(doc, params, report) {
    const ws = doc.wordTokens;
    const { levels, distinct } = ngramIds(ws, doc.wordKinds, Math.max(4, params.n));
    const share = (n: number) => (levels[n].length ? 1 - distinct[n] / levels[n].length : null);
    const undefinedMetrics: Record<string, string> = {};
    const seqRep = share(params.n);
    if (seqRep === null) undefinedMetrics.seq_rep_n = `fewer than ${params.n} words`;
    const distinct1 = ws.length ? distinct[1] / ws.length : null;
    const distinct2 = levels[2].length ? distinct[2] / levels[2].length : null;
    if (distinct1 === null) undefinedMetrics.distinct_1 = 'no words';
    if (distinct2 === null) undefinedMetrics.distinct_2 = 'fewer than 2 words';

    const duplicates = nearDuplicates(doc, levels[3], distinct[3], params.nearDuplicate, report);

    // most frequent n-gram character share; phrases are pointed at for the longest n over its limit
    const wordChars = ws.reduce((n, w) => n + w.text.length, 0);
    const limits: Record<number, number> = { 2: params.topShare2, 3: params.topShare3, 4: params.topShare4 };
    const tops = [2, 3, 4].map((n) => ({ n, ...mostFrequent(levels[n], distinct[n], ws, n, wordChars) }));
    const shares: Record<number, number | null> = {};
    for (const t of tops) {
      shares[t.n] = t.share;
      if (t.share === null) undefinedMetrics[`top_${t.n}gram_share`] = `fewer than ${t.n} words`;
    }
    // two occurrences in a short text are ordinary; Rae et al.'s limits were set for documents
    const exceeded = tops.filter((t) => t.share !== null && t.positions.length >= 3 && t.share > limits[t.n]);
    const worst = exceeded.at(-1);
    if (worst) {
      for (const p of worst.positions.slice(1, 21)) {
        const phrase = ws.slice(worst.positions[0], worst.positions[0] + worst.n).map((x) => x.lower).join(' ');
        report('repeated-phrase', { start: ws[p].start, end: ws[p + worst.n - 1].end }, { phrase, count: worst.positions.length, share: Math.round(worst.share! * 100) });
      }
    }
    const shareExceeded = exceeded.length > 0;

    const bytes = Buffer.byteLength(doc.text);
    const ratio = bytes >= 100 ? bytes / compressedSize(doc.text, bytes) : null;
    if (ratio === null) undefinedMetrics.compression_ratio = 'text under 100 bytes';
    if (seqRep !== null && seqRep > params.maxSeqRep && ws.length >= 2 * params.n) {
      report('high-seq-rep', { start: ws[0].start, end: ws[ws.length - 1].end }, { percent: Math.round(seqRep * 100), n: params.n });
    }
    if (ratio !== null && ratio > params.maxCompressionRatio) report('compressible', { start: 0, end: doc.text.length }, { ratio: ratio.toFixed(2) });

    const dupShare = doc.sentences.length ? duplicates / doc.sentences.length : 0;
    const penalty = Math.max(seqRep !== null && seqRep > params.maxSeqRep ? seqRep : 0, dupShare, shareExceeded ? 0.3 : 0, ratio !== null && ratio > params.maxCompressionRatio ? 0.5 : 0);
    return {
      metrics: {
        seq_rep_n: seqRep,
        distinct_1: distinct1,
        distinct_2: distinct2,
        duplicate_sentences: duplicates,
        compression_ratio: ratio,
        top_2gram_share: shares[2],
        top_3gram_share: shares[3],
        top_4gram_share: shares[4],
      },
      value: 1 - penalty,
      undefinedMetrics,
    };
  },
});

/**
 * Deflate size with zlib's defaults (level 6, memory level 8). The window is the smallest that
 * holds the whole text (2^9 … 2^15 bytes): for a text that fits, that gives exactly the output
 * of the default 32 KB window (the test compares them) while sparing the allocation of the
 * full window for every short response. (A smaller memory level as well would change the output.)
 */
export function compressedSize(text: string, bytes: number): number {
  const windowBits = Math.min(15, Math.max(9, Math.ceil(Math.log2(bytes + 262))));
  return deflateRawSync(text, { windowBits }).length;
}
