import { averageRanks, tieGroups } from './average-ranks.ts';
import { defined, undefinedBecause, type Estimate } from './result.ts';

/** Pearson's correlation coefficient; undefined when either variable is constant. */
export function pearson(x: readonly number[], y: readonly number[]): Estimate {
  const n = x.length;
  if (n !== y.length) throw new Error('pearson needs two lists of the same length');
  if (n < 2) return undefinedBecause('fewer than two pairs');
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
    syy += (y[i] - my) ** 2;
  }
  if (sxx === 0 || syy === 0) return undefinedBecause('one of the two lists has no variation');
  return defined(sxy / Math.sqrt(sxx * syy));
}

/** Spearman's rho: Pearson's correlation of average ranks (correct with ties, unlike 1 − 6Σd²/(n(n²−1))). */
export function spearmanRho(x: readonly number[], y: readonly number[]): Estimate {
  return pearson(averageRanks(x), averageRanks(y));
}

/**
 * Kendall's tau-b: (concordant − discordant) / √((n₀ − n₁)(n₀ − n₂)), n₁ and n₂ the pairs tied in
 * x and in y (Kendall 1945).
 */
export function kendallTauB(x: readonly number[], y: readonly number[]): Estimate {
  const n = x.length;
  if (n !== y.length) throw new Error('kendallTauB needs two lists of the same length');
  if (n < 2) return undefinedBecause('fewer than two pairs');
  let concordant = 0;
  let discordant = 0;
  let tiedX = 0;
  let tiedY = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const dx = Math.sign(x[i] - x[j]);
      const dy = Math.sign(y[i] - y[j]);
      if (dx === 0) tiedX++;
      if (dy === 0) tiedY++;
      if (dx !== 0 && dy !== 0) dx === dy ? concordant++ : discordant++;
    }
  }
  const n0 = (n * (n - 1)) / 2;
  const denominator = Math.sqrt((n0 - tiedX) * (n0 - tiedY));
  if (denominator === 0) return undefinedBecause('one of the two lists has no variation');
  return defined((concordant - discordant) / denominator);
}

/**
 * Kendall's W for m raters ranking the same n objects, with the tie correction:
 * W = 12S / (m²(n³ − n) − m·ΣT), T = Σ(t³ − t) over each rater's tie groups
 * (Kendall & Babington Smith 1939; correction as in Siegel & Castellan 1988).
 * `scores[r][i]` is rater r's value for object i; values are ranked per rater.
 */
export function kendallW(scores: readonly (readonly number[])[]): Estimate {
  const m = scores.length;
  if (m < 2) return undefinedBecause('fewer than two raters');
  const n = scores[0].length;
  if (n < 2) return undefinedBecause('fewer than two objects');
  if (scores.some((s) => s.length !== n)) return undefinedBecause('every rater must rank every object');
  const ranks = scores.map((s) => averageRanks(s));
  const totals = Array.from({ length: n }, (_, i) => ranks.reduce((a, r) => a + r[i], 0));
  const mean = totals.reduce((a, b) => a + b, 0) / n;
  const S = totals.reduce((a, t) => a + (t - mean) ** 2, 0);
  const T = scores.reduce((a, s) => a + tieGroups(s).reduce((b, t) => b + t ** 3 - t, 0), 0);
  const denominator = m * m * (n ** 3 - n) - m * T;
  if (denominator === 0) return undefinedBecause('every rater tied every object');
  return defined((12 * S) / denominator);
}
