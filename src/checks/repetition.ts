import { deflateRawSync } from 'node:zlib';
import { isWord, type Doc, type Token } from '../text/analyze.ts';
import { defineCheck } from './define-check.ts';

interface Params {
  n: number;
  maxSeqRep: number;
  nearDuplicate: number;
  maxCompressionRatio: number;
  topShare2: number;
  topShare3: number;
  topShare4: number;
}

function words(doc: Doc): Token[] {
  return doc.tokens.filter(isWord);
}

function ngramKeys(ws: Token[], n: number): string[] {
  const keys: string[] = [];
  for (let i = 0; i + n <= ws.length; i++) {
    let key = ws[i].lower;
    for (let k = 1; k < n; k++) key += ` ${ws[i + k].lower}`;
    keys.push(key);
  }
  return keys;
}

/** 1 − unique/total of the keys; null for no keys. */
function repeatShare(keys: string[]): number | null {
  return keys.length ? 1 - new Set(keys).size / keys.length : null;
}

function shingles(ws: Token[]): Set<string> {
  if (ws.length < 3) return new Set([ws.map((w) => w.lower).join(' ')]);
  return new Set(ngramKeys(ws, 3));
}

/** How many earlier sentences sharing a shingle are compared with each sentence at most. */
const MAX_CANDIDATES = 50;

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
    const ws = words(doc);
    const undefinedMetrics: Record<string, string> = {};
    const seqRep = repeatShare(ngramKeys(ws, params.n));
    if (seqRep === null) undefinedMetrics.seq_rep_n = `fewer than ${params.n} words`;
    const distinct1 = ws.length ? new Set(ws.map((w) => w.lower)).size / ws.length : null;
    const bigrams = ngramKeys(ws, 2);
    const distinct2 = bigrams.length ? new Set(bigrams).size / bigrams.length : null;
    if (distinct1 === null) undefinedMetrics.distinct_1 = 'no words';
    if (distinct2 === null) undefinedMetrics.distinct_2 = 'fewer than 2 words';

    // near-duplicate sentences
    const index = new Map<string, number[]>();
    const sentenceShingles: Set<string>[] = [];
    let duplicates = 0;
    for (const s of doc.sentences) {
      const sw = doc.tokens.slice(s.firstToken, s.endToken).filter(isWord);
      const own = sw.length ? shingles(sw) : new Set<string>();
      sentenceShingles.push(own);
      if (!own.size) continue;
      const seen = new Map<number, number>();
      for (const sh of own) for (const j of index.get(sh) ?? []) seen.set(j, (seen.get(j) ?? 0) + 1);
      let best = -1;
      let bestSim = 0;
      for (const [j, shared] of [...seen].slice(-MAX_CANDIDATES)) {
        const sim = shared / (own.size + sentenceShingles[j].size - shared);
        if (sim > bestSim) [best, bestSim] = [j, sim];
      }
      if (best >= 0 && bestSim >= params.nearDuplicate) {
        duplicates++;
        const earlier = doc.sentences[best];
        report('repeated-sentence', s, { similarity: bestSim.toFixed(2) }, earlier);
      }
      for (const sh of own) {
        const list = index.get(sh);
        if (list) list.push(s.index);
        else index.set(sh, [s.index]);
      }
    }

    // most frequent n-gram character share; phrases are pointed at for the longest n over its limit
    const wordChars = ws.reduce((n, w) => n + w.text.length, 0);
    const limits: Record<number, number> = { 2: params.topShare2, 3: params.topShare3, 4: params.topShare4 };
    const tops = [2, 3, 4].map((n) => ({ n, ...mostFrequent(ngramKeys(ws, n), wordChars) }));
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
        report('repeated-phrase', { start: ws[p].start, end: ws[p + worst.n - 1].end }, { phrase: worst.key, count: worst.positions.length, share: Math.round(worst.share! * 100) });
      }
    }
    const shareExceeded = exceeded.length > 0;

    const bytes = Buffer.byteLength(doc.text);
    const ratio = bytes >= 100 ? bytes / deflateRawSync(doc.text).length : null;
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

/** The most frequent key, where it occurs, and the share of word characters its occurrences cover. */
function mostFrequent(keys: string[], wordChars: number): { key: string; positions: number[]; share: number | null } {
  if (!keys.length || !wordChars) return { key: '', positions: [], share: null };
  const where = new Map<string, number[]>();
  keys.forEach((k, i) => {
    const list = where.get(k);
    if (list) list.push(i);
    else where.set(k, [i]);
  });
  let key = '';
  let positions: number[] = [];
  for (const [k, list] of where) if (list.length > positions.length) [key, positions] = [k, list];
  const share = positions.length > 1 ? Math.min(1, (positions.length * key.replace(/ /g, '').length) / wordChars) : 0;
  return { key, positions, share };
}
