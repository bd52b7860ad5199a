import { describe, expect, it } from 'vitest';
import { bradleyTerry, winsFromPairs } from '../../src/stats/bradley-terry.ts';
import { crossValidate, fitPairwiseLogistic, pairwiseAccuracy, pairwiseLoss, type FeaturePair } from '../../src/stats/pairwise-logistic.ts';
import { seededRandom } from '../../src/stats/seeded-random.ts';

describe('Bradley–Terry strengths by the MM algorithm (Hunter 2004)', () => {
  it('4 teams, 22 games → 0.640, 1.043, 0.660, 2.270 with geometric mean 1 (REFERENCES.md; memory of a widely used textbook-style example)', () => {
    const wins = [
      [0, 2, 0, 1],
      [3, 0, 5, 0],
      [0, 3, 0, 1],
      [4, 0, 3, 0],
    ];
    const result = bradleyTerry(['A', 'B', 'C', 'D'], wins);
    expect(result.converged).toBe(true);
    const expected = [0.64, 1.043, 0.66, 2.27];
    result.strengths.forEach((s, i) => expect(s).toBeCloseTo(expected[i], 3));
    expect(result.strengths.reduce((a, s) => a * s, 1)).toBeCloseTo(1, 10);
  });

  it('refuses a comparison graph that is not strongly connected, naming the groups (Ford 1957)', () => {
    const { names, wins } = winsFromPairs([['a', 'b'], ['b', 'a'], ['a', 'c'], ['b', 'c']]);
    expect(() => bradleyTerry(names, wins)).toThrow(/not strongly connected — \{c\} and \{a, b\}|not strongly connected — \{a, b\} and \{c\}/);
  });

  it('counts wins from (winner, loser) pairs', () => {
    expect(winsFromPairs([['x', 'y'], ['x', 'y'], ['y', 'x']])).toEqual({ names: ['x', 'y'], wins: [[0, 2], [1, 0]] });
  });
});

describe('pairwise logistic weights: P(a ≻ b) = σ(w·(f(a) − f(b)))', () => {
  it('has the reward-model loss at margins 0, +1, −1: ln 2, 0.313262, 1.313262 (Ouyang et al. 2022, eq. 1)', () => {
    const pair = (margin: number): FeaturePair[] => [{ winner: [margin], loser: [0] }];
    expect(pairwiseLoss([1], pair(0))).toBeCloseTo(Math.LN2, 6);
    expect(pairwiseLoss([1], pair(1))).toBeCloseTo(0.313262, 6);
    expect(pairwiseLoss([1], pair(-1))).toBeCloseTo(1.313262, 6);
  });

  it('recovers the ordering of known weights from synthetic decisions and reaches the generating model\'s held-out accuracy within 0.02', () => {
    const random = seededRandom(42);
    const normal = () => Math.sqrt(-2 * Math.log(random() + 1e-12)) * Math.cos(2 * Math.PI * random());
    const truth = [2.0, -1.2, 0.7, 0.3, 0];
    const pairs: FeaturePair[] = [];
    for (let i = 0; i < 6000; i++) {
      const a = truth.map(() => normal());
      const b = truth.map(() => normal());
      const margin = truth.reduce((s, w, k) => s + w * (a[k] - b[k]), 0);
      const aWins = random() < 1 / (1 + Math.exp(-margin));
      pairs.push(aWins ? { winner: a, loser: b } : { winner: b, loser: a });
    }
    const { weights, heldOutAccuracy } = crossValidate(pairs, { folds: 5, seed: 3 });
    const order = (w: number[]) => w.map((x, i) => [x, i]).sort((p, q) => q[0] - p[0]).map((p) => p[1]);
    expect(order(weights)).toEqual(order(truth));
    const generating = pairwiseAccuracy(truth, pairs)!;
    console.log(`held-out accuracy ${heldOutAccuracy!.toFixed(4)}; generating model ${generating.toFixed(4)}`);
    expect(heldOutAccuracy!).toBeGreaterThanOrEqual(generating - 0.02);
    expect(weights[0]).toBeCloseTo(2, 0);
  });

  it('stays finite on separable or empty data (L2 keeps the weights bounded)', () => {
    const separable: FeaturePair[] = [{ winner: [1, 0], loser: [0, 0] }, { winner: [2, 1], loser: [0, 1] }];
    const w = fitPairwiseLogistic(separable, { l2: 0.01 });
    expect(w.every(Number.isFinite)).toBe(true);
    expect(pairwiseAccuracy(w, separable)).toBe(1);
    expect(pairwiseAccuracy([1], [])).toBeNull();
    expect(crossValidate([], {}).heldOutAccuracy).toBeNull();
  });
});
