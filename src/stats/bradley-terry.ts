import { UserError } from '../errors.ts';

export interface StrengthsResult {
  names: string[];
  /** Strengths γ, scaled to a geometric mean of 1. */
  strengths: number[];
  iterations: number;
  converged: boolean;
}

/** Strongly connected components of the "beat" graph (Tarjan), as lists of indices. */
function components(n: number, beat: boolean[][]): number[][] {
  let counter = 0;
  const index = new Array<number>(n).fill(-1);
  const low = new Array<number>(n).fill(0);
  const onStack = new Array<boolean>(n).fill(false);
  const stack: number[] = [];
  const out: number[][] = [];
  const visit = (v: number) => {
    index[v] = low[v] = counter++;
    stack.push(v);
    onStack[v] = true;
    for (let w = 0; w < n; w++) {
      if (!beat[v][w]) continue;
      if (index[w] < 0) {
        visit(w);
        low[v] = Math.min(low[v], low[w]);
      } else if (onStack[w]) low[v] = Math.min(low[v], index[w]);
    }
    if (low[v] === index[v]) {
      const component: number[] = [];
      let w: number;
      do {
        w = stack.pop()!;
        onStack[w] = false;
        component.push(w);
      } while (w !== v);
      out.push(component);
    }
  };
  for (let v = 0; v < n; v++) if (index[v] < 0) visit(v);
  return out;
}

/**
 * Bradley–Terry strengths, P(i ≻ j) = γᵢ/(γᵢ + γⱼ), by the MM algorithm of Hunter (2004):
 * γᵢ ← Wᵢ / Σⱼ Nᵢⱼ/(γᵢ + γⱼ), renormalised each sweep to a geometric mean of 1. A unique maximum
 * exists only when every competitor can reach every other through wins (Ford 1957); otherwise a
 * `UserError` names the groups that never beat each other.
 *
 * @param wins wins[i][j] = how often i beat j.
 */
export function bradleyTerry(names: string[], wins: readonly (readonly number[])[], options: { tolerance?: number; maxIterations?: number } = {}): StrengthsResult {
  const n = names.length;
  if (n < 2) throw new UserError('Bradley–Terry needs at least two competitors');
  const beat = wins.map((row) => row.map((w) => w > 0));
  const parts = components(n, beat);
  if (parts.length > 1) {
    const groups = parts.map((p) => `{${p.map((i) => names[i]).sort().join(', ')}}`).join(' and ');
    throw new UserError(`the comparisons are not strongly connected — ${groups} cannot all be reached from each other through wins, so their strengths have no unique estimate; add comparisons between these groups`);
  }
  const total = wins.map((row) => row.reduce((a, b) => a + b, 0));
  let gamma = new Array<number>(n).fill(1);
  const tolerance = options.tolerance ?? 1e-12;
  const maxIterations = options.maxIterations ?? 100_000;
  let iterations = 0;
  let converged = false;
  while (iterations < maxIterations) {
    iterations++;
    const next = gamma.map((g, i) => {
      let denominator = 0;
      for (let j = 0; j < n; j++) {
        const games = wins[i][j] + wins[j][i];
        if (j !== i && games) denominator += games / (g + gamma[j]);
      }
      return total[i] / denominator;
    });
    const logMean = next.reduce((a, g) => a + Math.log(g), 0) / n;
    const scaled = next.map((g) => g / Math.exp(logMean));
    const change = Math.max(...scaled.map((g, i) => Math.abs(g - gamma[i])));
    gamma = scaled;
    if (change < tolerance) {
      converged = true;
      break;
    }
  }
  return { names, strengths: gamma, iterations, converged };
}

/** Wins from a list of (winner, loser) comparisons. */
export function winsFromPairs(pairs: readonly [string, string][]): { names: string[]; wins: number[][] } {
  const names = [...new Set(pairs.flat())].sort();
  const index = new Map(names.map((name, i) => [name, i]));
  const wins = names.map(() => new Array<number>(names.length).fill(0));
  for (const [w, l] of pairs) wins[index.get(w)!][index.get(l)!]++;
  return { names, wins };
}
