import { krippendorffAlpha, type AlphaLevel } from './krippendorff-alpha.ts';
import { fleissKappa } from './kappa.ts';
import { kendallW } from './rank-correlation.ts';
import { bootstrapInterval } from './bootstrap.ts';
import type { Estimate } from './result.ts';

/** One rating: a rater's value for a unit. */
export interface Rating {
  unit: string;
  rater: string;
  value: number;
}

export interface ReliabilityReport {
  units: number;
  raters: number;
  ratings: number;
  krippendorffAlpha: Record<AlphaLevel, Estimate>;
  fleissKappa: Estimate;
  kendallW: Estimate;
  /** Share of rater pairs on the same unit who gave the same value. */
  pairwiseAgreement: Estimate;
  pairwiseAgreementInterval: { low: number; high: number } | null;
}

function pairShare(units: number[][]): number | null {
  let pairs = 0;
  let same = 0;
  for (const values of units) {
    for (let i = 0; i < values.length; i++) {
      for (let j = i + 1; j < values.length; j++) {
        pairs++;
        if (values[i] === values[j]) same++;
      }
    }
  }
  return pairs ? same / pairs : null;
}

/**
 * Agreement statistics for unit/rater/value data: Krippendorff's alpha at every level, Fleiss'
 * kappa on the values as categories (when every unit has the same number of ratings), Kendall's
 * W (when every rater rated every unit), and the share of agreeing rater pairs with a 95%
 * bootstrap interval over units.
 */
export function reliabilityReport(ratings: Rating[]): ReliabilityReport {
  const byUnit = new Map<string, Map<string, number>>();
  for (const r of ratings) {
    const unit = byUnit.get(r.unit) ?? new Map<string, number>();
    unit.set(r.rater, r.value);
    byUnit.set(r.unit, unit);
  }
  const raters = [...new Set(ratings.map((r) => r.rater))].sort();
  const unitValues = [...byUnit.values()].map((m) => [...m.values()]);
  const alpha = Object.fromEntries((['nominal', 'ordinal', 'interval', 'ratio'] as AlphaLevel[]).map((level) => [level, krippendorffAlpha(unitValues, level)])) as Record<AlphaLevel, Estimate>;
  const categories = [...new Set(ratings.map((r) => r.value))].sort((a, b) => a - b);
  const fleiss = fleissKappa(unitValues.map((values) => categories.map((c) => values.filter((v) => v === c).length)));
  const complete = [...byUnit.values()].every((m) => raters.every((r) => m.has(r)));
  const w: Estimate = complete ? kendallW(raters.map((r) => [...byUnit.values()].map((m) => m.get(r)!))) : { value: null, reason: 'not every rater rated every unit' };
  const share = pairShare(unitValues);
  return {
    units: byUnit.size,
    raters: raters.length,
    ratings: ratings.length,
    krippendorffAlpha: alpha,
    fleissKappa: fleiss.value === null ? fleiss : { value: fleiss.value },
    kendallW: w,
    pairwiseAgreement: share === null ? { value: null, reason: 'no unit has two ratings' } : { value: share },
    pairwiseAgreementInterval: bootstrapInterval(unitValues, (sample) => pairShare(sample)),
  };
}
