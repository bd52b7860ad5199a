import { seededRandom } from './seeded-random.ts';
/** A decided pair: the features of the preferred response and of the other. */
export interface FeaturePair {
  winner: readonly number[];
  loser: readonly number[];
}

const sigmoid = (z: number) => (z >= 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z)));

/** Solves A·x = b for a symmetric positive definite A (Cholesky). */
function solve(A: number[][], b: number[]): number[] {
  const n = b.length;
  const L = A.map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = A[i][j];
      for (let k = 0; k < j; k++) s -= L[i][k] * L[j][k];
      L[i][j] = i === j ? Math.sqrt(Math.max(s, 1e-300)) : s / L[j][j];
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= L[i][k] * y[k];
    y[i] = s / L[i][i];
  }
  const x = new Array<number>(n).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= L[k][i] * x[k];
    x[i] = s / L[i][i];
  }
  return x;
}

/**
 * Fits weights w for P(a ≻ b) = σ(w · (f(a) − f(b))) — the Bradley–Terry model on feature
 * differences, and the pairwise loss used to train reward models (Ouyang et al. 2022, eq. 1) —
 * minimising the mean of −log σ(w·d) + (λ/2)‖w‖² by Newton's method.
 */
export function fitPairwiseLogistic(pairs: readonly FeaturePair[], options: { l2?: number; maxIterations?: number } = {}): number[] {
  const d = pairs[0]?.winner.length ?? 0;
  const lambda = options.l2 ?? 1e-3;
  const diffs = pairs.map((p) => p.winner.map((x, k) => x - p.loser[k]));
  let w = new Array<number>(d).fill(0);
  for (let iteration = 0; iteration < (options.maxIterations ?? 50); iteration++) {
    const gradient = w.map((x) => lambda * x);
    const hessian = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => (i === j ? lambda : 0)));
    const n = diffs.length || 1;
    for (const x of diffs) {
      let z = 0;
      for (let k = 0; k < d; k++) z += w[k] * x[k];
      const p = sigmoid(z);
      const g = (p - 1) / n;
      const h = (p * (1 - p)) / n;
      for (let i = 0; i < d; i++) {
        gradient[i] += g * x[i];
        const hx = h * x[i];
        for (let j = 0; j <= i; j++) hessian[i][j] += hx * x[j];
      }
    }
    for (let i = 0; i < d; i++) for (let j = 0; j < i; j++) hessian[j][i] = hessian[i][j];
    const step = solve(hessian, gradient);
    w = w.map((x, k) => x - step[k]);
    if (Math.max(...step.map(Math.abs)) < 1e-10) break;
  }
  return w;
}

/** Share of pairs whose winner the weights score higher (a tie counts half). */
export function pairwiseAccuracy(weights: readonly number[], pairs: readonly FeaturePair[]): number | null {
  if (!pairs.length) return null;
  let correct = 0;
  for (const p of pairs) {
    let z = 0;
    for (let k = 0; k < weights.length; k++) z += weights[k] * (p.winner[k] - p.loser[k]);
    correct += z > 0 ? 1 : z === 0 ? 0.5 : 0;
  }
  return correct / pairs.length;
}

/** Mean −log σ(w·(f(winner) − f(loser))): the pairwise reward-model loss (Ouyang et al. 2022, eq. 1). */
export function pairwiseLoss(weights: readonly number[], pairs: readonly FeaturePair[]): number {
  let loss = 0;
  for (const p of pairs) {
    let z = 0;
    for (let k = 0; k < weights.length; k++) z += weights[k] * (p.winner[k] - p.loser[k]);
    loss += z >= 0 ? Math.log1p(Math.exp(-z)) : -z + Math.log1p(Math.exp(z));
  }
  return pairs.length ? loss / pairs.length : 0;
}

/**
 * k-fold cross-validated held-out pairwise accuracy of the fitted model (folds by position after
 * a seeded shuffle), and the weights fitted on all pairs.
 */
export function crossValidate(pairs: readonly FeaturePair[], options: { folds?: number; l2?: number; seed?: number } = {}): { weights: number[]; heldOutAccuracy: number | null } {
  const folds = Math.min(options.folds ?? 5, pairs.length);
  const order = pairs.map((_, i) => i);
  const random = seededRandom(options.seed ?? 1);
  for (let i = order.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [order[i], order[j]] = [order[j], order[i]];
  }
  let correct = 0;
  let counted = 0;
  for (let f = 0; f < folds; f++) {
    const test = order.filter((_, i) => i % folds === f).map((i) => pairs[i]);
    const train = order.filter((_, i) => i % folds !== f).map((i) => pairs[i]);
    if (!test.length || !train.length) continue;
    const w = fitPairwiseLogistic(train, { l2: options.l2 });
    correct += pairwiseAccuracy(w, test)! * test.length;
    counted += test.length;
  }
  return { weights: fitPairwiseLogistic(pairs, { l2: options.l2 }), heldOutAccuracy: counted ? correct / counted : null };
}
