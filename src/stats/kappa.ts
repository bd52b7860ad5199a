import { defined, undefinedBecause, type Estimate } from './result.ts';

/**
 * Cohen's kappa for two raters' labels of the same items: (pₒ − pₑ) / (1 − pₑ) (Cohen 1960).
 * Undefined when chance agreement is already certain (both raters used one and the same label).
 */
export function cohenKappa(a: readonly (string | number)[], b: readonly (string | number)[]): Estimate & { observed?: number; chance?: number } {
  if (a.length !== b.length) throw new Error('cohenKappa needs two label lists of the same length');
  if (!a.length) return undefinedBecause('no items');
  let agree = 0;
  const ca = new Map<string | number, number>();
  const cb = new Map<string | number, number>();
  a.forEach((x, i) => {
    if (x === b[i]) agree++;
    ca.set(x, (ca.get(x) ?? 0) + 1);
    cb.set(b[i], (cb.get(b[i]) ?? 0) + 1);
  });
  const n = a.length;
  const po = agree / n;
  let pe = 0;
  for (const [label, count] of ca) pe += (count / n) * ((cb.get(label) ?? 0) / n);
  if (pe === 1) return undefinedBecause('both raters used one and the same label for every item');
  return { ...defined((po - pe) / (1 - pe)), observed: po, chance: pe };
}

/**
 * Fleiss' kappa from a subjects × categories table of counts, every subject rated by the same
 * number of raters (Fleiss 1971): κ = (P̄ − P̄ₑ) / (1 − P̄ₑ).
 */
export function fleissKappa(table: readonly (readonly number[])[]): Estimate & { observed?: number; chance?: number } {
  if (!table.length) return undefinedBecause('no subjects');
  const raters = table[0].reduce((a, b) => a + b, 0);
  if (raters < 2) return undefinedBecause('each subject needs two or more ratings');
  if (table.some((row) => row.reduce((a, b) => a + b, 0) !== raters)) return undefinedBecause('every subject must be rated by the same number of raters');
  const N = table.length;
  const k = table[0].length;
  const p = new Array<number>(k).fill(0);
  let pBar = 0;
  for (const row of table) {
    let squares = 0;
    row.forEach((n, j) => {
      squares += n * n;
      p[j] += n;
    });
    pBar += (squares - raters) / (raters * (raters - 1));
  }
  pBar /= N;
  const pe = p.reduce((s, x) => s + (x / (N * raters)) ** 2, 0);
  if (pe === 1) return undefinedBecause('every rating fell in one category');
  return { ...defined((pBar - pe) / (1 - pe)), observed: pBar, chance: pe };
}
