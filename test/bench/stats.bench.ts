import { crossValidate, type FeaturePair } from '../../src/stats/pairwise-logistic.ts';
import { seededRandom } from '../../src/stats/seeded-random.ts';
import type { BenchRow } from './report.ts';

/** Issue 7's figure: the pairwise weight fit on 100,000 pairs × 20 features. */
export async function statsBench(options: { quick: boolean }): Promise<BenchRow[]> {
  const count = options.quick ? 20_000 : 100_000;
  const features = 20;
  const random = seededRandom(9);
  const truth = Array.from({ length: features }, (_, k) => (k % 3 === 0 ? 1 : -0.5) * (1 + k / 10));
  const pairs: FeaturePair[] = [];
  for (let i = 0; i < count; i++) {
    const a = truth.map(() => random() * 2 - 1);
    const b = truth.map(() => random() * 2 - 1);
    const margin = truth.reduce((s, w, k) => s + w * (a[k] - b[k]), 0);
    pairs.push(random() < 1 / (1 + Math.exp(-margin)) ? { winner: a, loser: b } : { winner: b, loser: a });
  }
  const t0 = performance.now();
  const { heldOutAccuracy } = crossValidate(pairs, { folds: 5 });
  const seconds = (performance.now() - t0) / 1000;
  return [{ area: 'stats', name: `pairwise weight fit, ${count.toLocaleString('en')} pairs × ${features} features, 5-fold CV + final fit (held-out accuracy ${heldOutAccuracy!.toFixed(3)})`, value: seconds, unit: 's' }];
}
