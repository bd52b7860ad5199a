/** A ranking: item id → rank (1 is best; equal ranks are ties). */
export type Ranks = Record<string, number>;

/**
 * Pairwise agreement of two rankings of the same candidates: among the pairs that `reference`
 * orders strictly (ties left out), the share that `other` orders the same way. A pair `other`
 * ties counts as half agreement. Returns null when no pair is comparable.
 *
 * @example
 * pairwiseAgreement({ a: 1, b: 2, c: 3 }, { a: 1, b: 3, c: 2 }) // 2/3
 */
export function pairwiseAgreement(reference: Ranks, other: Ranks): number | null {
  const ids = Object.keys(reference).filter((id) => id in other);
  let pairs = 0;
  let agree = 0;
  for (let i = 0; i < ids.length; i++) {
    for (let j = i + 1; j < ids.length; j++) {
      const r = Math.sign(reference[ids[i]] - reference[ids[j]]);
      if (r === 0) continue;
      pairs++;
      const o = Math.sign(other[ids[i]] - other[ids[j]]);
      agree += o === r ? 1 : o === 0 ? 0.5 : 0;
    }
  }
  return pairs ? agree / pairs : null;
}
