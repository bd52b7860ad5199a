import type { Rubric } from '../rubric/load.ts';
import type { CalibrationItem } from './calibration.ts';
import { crossValidate, pairwiseAccuracy, type FeaturePair } from './pairwise-logistic.ts';

export interface LearnedWeights {
  criteria: string[];
  pairs: number;
  /** Held-out pairwise accuracy of the rubric's present weights (they were not fitted, so all pairs are held out). */
  currentAccuracy: number | null;
  /** Cross-validated held-out pairwise accuracy of the fitted weights. */
  fittedAccuracy: number | null;
  /** The fitted weights on the rubric's scale: negatives become 0, the total kept equal to the rubric's. */
  suggested: Record<string, number>;
  /** Fitted weights as estimated (may be negative). */
  raw: Record<string, number>;
}

/**
 * Fits criterion weights to the final human decisions: every strictly ordered pair of a final
 * ranking is a training pair, the features are the criteria values of the two responses, and
 * the model is P(a ≻ b) = σ(w · (f(a) − f(b))) with L2 regularisation. Offered to the policy
 * owner as a draft — never applied by itself.
 */
export function learnWeights(rubric: Rubric, items: CalibrationItem[], options: { folds?: number; l2?: number } = {}): LearnedWeights {
  const criteria = rubric.criteria.map((c) => c.id);
  const pairs: FeaturePair[] = [];
  for (const item of items) {
    const features = (id: string) => criteria.map((c) => item.criteria[c]?.[id] ?? 0);
    const ids = Object.keys(item.final);
    for (let i = 0; i < ids.length; i++) {
      for (let j = 0; j < ids.length; j++) {
        if (item.final[ids[i]] < item.final[ids[j]]) pairs.push({ winner: features(ids[i]), loser: features(ids[j]) });
      }
    }
  }
  const current = rubric.criteria.map((c) => c.weight);
  const { weights, heldOutAccuracy } = crossValidate(pairs, { folds: options.folds ?? 5, l2: options.l2 ?? 0.05 });
  const total = current.reduce((a, b) => a + b, 0);
  const positive = weights.map((w) => Math.max(0, w));
  const positiveTotal = positive.reduce((a, b) => a + b, 0);
  const scaled = positive.map((w) => (positiveTotal > 0 ? Math.round(((w * total) / positiveTotal) * 100) / 100 : 0));
  return {
    criteria,
    pairs: pairs.length,
    currentAccuracy: pairwiseAccuracy(current, pairs),
    fittedAccuracy: heldOutAccuracy,
    suggested: Object.fromEntries(criteria.map((c, i) => [c, scaled[i]])),
    raw: Object.fromEntries(criteria.map((c, i) => [c, Math.round((weights[i] ?? 0) * 1000) / 1000])),
  };
}
