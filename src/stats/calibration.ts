import { pairwiseAgreement, type Ranks } from './pairwise-agreement.ts';

/** What calibration needs about one decided item. */
export interface CalibrationItem {
  /** Final human ranking (1 best). */
  final: Ranks;
  /** Suggested ranks from the stored scores. */
  suggested: Ranks;
  /** Per criterion: response id → value. */
  criteria: Record<string, Record<string, number>>;
  /** Response id → text length in characters. */
  lengths: Record<string, number>;
  reviews: { reviewer: string; displayOrder: string[]; first: Ranks | null; final: Ranks | null; revealed: boolean }[];
}

export interface Share {
  value: number | null;
  pairs: number;
}

export interface Calibration {
  items: number;
  suggestedOrder: Share;
  criteria: Record<string, Share>;
  /** Share of decided pairs the longer response won (0.5: no length bias). */
  lengthBias: Share;
  /** Share of reviewed pairs where the response shown earlier was ranked better (0.5: no position bias). */
  positionBias: Share;
  /** Of revisions made after the reveal, the share that moved toward the suggested order. */
  anchoring: { revisions: number; towardSuggested: number; share: number | null };
  /** Each reviewer's mean pairwise agreement with the final decisions. */
  reviewers: Record<string, Share>;
}

/** Visits every strictly ordered pair of a ranking: (better, worse). */
function forEachPair(ranks: Ranks, visit: (better: string, worse: string) => void) {
  const ids = Object.keys(ranks);
  for (let i = 0; i < ids.length; i++) {
    for (let j = i + 1; j < ids.length; j++) {
      const d = ranks[ids[i]] - ranks[ids[j]];
      if (d < 0) visit(ids[i], ids[j]);
      else if (d > 0) visit(ids[j], ids[i]);
    }
  }
}

class Tally {
  hits = 0;
  pairs = 0;
  add(score: number) {
    this.hits += score;
    this.pairs++;
  }
  share(): Share {
    return { value: this.pairs ? this.hits / this.pairs : null, pairs: this.pairs };
  }
}

const compare = (better: number | undefined, worse: number | undefined) => (better === undefined || worse === undefined ? null : better > worse ? 1 : better === worse ? 0.5 : 0);

/**
 * How the heuristics line up with people's final decisions, pair by pair: the suggested order
 * and each criterion alone (pairwise accuracy), length bias (does the longer response win?),
 * display-position bias, anchoring after the reveal, and each reviewer's agreement with the
 * decisions. Shares are over strictly ordered pairs; undefined shares are null.
 */
export function calibrate(items: CalibrationItem[]): Calibration {
  const suggested = new Tally();
  const criteria = new Map<string, Tally>();
  const length = new Tally();
  const position = new Tally();
  const reviewers = new Map<string, Tally>();
  let revisions = 0;
  let toward = 0;
  for (const item of items) {
    forEachPair(item.final, (better, worse) => {
      suggested.add(compare(-item.suggested[better], -item.suggested[worse]) ?? 0.5);
      for (const [id, values] of Object.entries(item.criteria)) {
        const c = compare(values[better], values[worse]);
        if (c === null) continue;
        const tally = criteria.get(id) ?? new Tally();
        tally.add(c);
        criteria.set(id, tally);
      }
      if (item.lengths[better] !== item.lengths[worse]) length.add(item.lengths[better] > item.lengths[worse] ? 1 : 0);
    });
    for (const review of item.reviews) {
      const ranking = review.first ?? review.final;
      if (ranking) {
        const shown = new Map(review.displayOrder.map((id, i) => [id, i]));
        forEachPair(ranking, (better, worse) => {
          if (shown.has(better) && shown.has(worse)) position.add(shown.get(better)! < shown.get(worse)! ? 1 : 0);
        });
      }
      if (review.final) {
        const agreement = pairwiseAgreement(item.final, review.final);
        if (agreement !== null) {
          const tally = reviewers.get(review.reviewer) ?? new Tally();
          tally.hits += agreement;
          tally.pairs++;
          reviewers.set(review.reviewer, tally);
        }
      }
      if (review.revealed && review.first && review.final && JSON.stringify(review.first) !== JSON.stringify(review.final)) {
        revisions++;
        const before = pairwiseAgreement(review.first, item.suggested) ?? 0;
        const after = pairwiseAgreement(review.final, item.suggested) ?? 0;
        if (after > before) toward++;
      }
    }
  }
  return {
    items: items.length,
    suggestedOrder: suggested.share(),
    criteria: Object.fromEntries([...criteria].sort(([a], [b]) => a.localeCompare(b)).map(([id, t]) => [id, t.share()])),
    lengthBias: length.share(),
    positionBias: position.share(),
    anchoring: { revisions, towardSuggested: toward, share: revisions ? toward / revisions : null },
    reviewers: Object.fromEntries([...reviewers].map(([id, t]) => [id, { value: t.pairs ? t.hits / t.pairs : null, pairs: t.pairs }])),
  };
}
