import { defined, undefinedBecause, type Estimate } from './result.ts';

export type AlphaLevel = 'nominal' | 'ordinal' | 'interval' | 'ratio';

/** Reliability data: per unit, the values the observers gave (missing values left out). */
export type Units = readonly (readonly number[])[];

/**
 * Krippendorff's alpha = 1 − Dₒ/Dₑ from the coincidence matrix, for nominal, ordinal, interval
 * and ratio data, with missing values (Krippendorff 2011, "Computing Krippendorff's
 * Alpha-Reliability"). Units with fewer than two values are not pairable and are left out.
 * Undefined (null, with the reason) when no unit is pairable or every value is the same.
 */
export function krippendorffAlpha(units: Units, level: AlphaLevel): Estimate {
  const values = [...new Set(units.flat())].sort((a, b) => a - b);
  const index = new Map(values.map((v, i) => [v, i]));
  const k = values.length;
  const o = Array.from({ length: k }, () => new Float64Array(k));
  let pairable = 0;
  for (const unit of units) {
    const m = unit.length;
    if (m < 2) continue;
    pairable++;
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        if (i !== j) o[index.get(unit[i])!][index.get(unit[j])!] += 1 / (m - 1);
      }
    }
  }
  if (!pairable) return undefinedBecause('no unit has two or more values to pair');
  const nc = o.map((row) => row.reduce((a, b) => a + b, 0));
  const n = nc.reduce((a, b) => a + b, 0);
  if (k < 2) return undefinedBecause('every value is the same, so agreement cannot be told from chance');
  const delta = distance(level, values, nc);
  let observed = 0;
  let expected = 0;
  for (let c = 0; c < k; c++) {
    for (let d = 0; d < k; d++) {
      const dd = delta(c, d);
      observed += o[c][d] * dd;
      expected += nc[c] * nc[d] * dd;
    }
  }
  observed /= n;
  expected /= n * (n - 1);
  if (expected === 0) return undefinedBecause('the expected disagreement is zero');
  return defined(1 - observed / expected);
}

/** The squared difference function δ² of each level of measurement, over value indices. */
function distance(level: AlphaLevel, values: number[], nc: number[]): (c: number, d: number) => number {
  switch (level) {
    case 'nominal':
      return (c, d) => (c === d ? 0 : 1);
    case 'interval':
      return (c, d) => (values[c] - values[d]) ** 2;
    case 'ratio':
      return (c, d) => (values[c] + values[d] === 0 ? 0 : ((values[c] - values[d]) / (values[c] + values[d])) ** 2);
    case 'ordinal': {
      const cumulative = [0];
      for (const x of nc) cumulative.push(cumulative.at(-1)! + x);
      return (c, d) => {
        if (c === d) return 0;
        const [lo, hi] = c < d ? [c, d] : [d, c];
        const between = cumulative[hi + 1] - cumulative[lo];
        return (between - (nc[c] + nc[d]) / 2) ** 2;
      };
    }
  }
}
