/**
 * Ranks of values, 1 for the smallest, tied values sharing the average of their positions
 * ("fractional" ranking, the ranks Spearman's rho and Kendall's W use).
 *
 * @example
 * averageRanks([5, 6, 7, 8, 7]) // [1, 2, 3.5, 5, 3.5]
 */
export function averageRanks(values: readonly number[]): number[] {
  const order = values.map((v, i) => [v, i] as const).sort((a, b) => a[0] - b[0]);
  const ranks = new Array<number>(values.length);
  for (let i = 0; i < order.length; ) {
    let j = i;
    while (j + 1 < order.length && order[j + 1][0] === order[i][0]) j++;
    const rank = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) ranks[order[k][1]] = rank;
    i = j + 1;
  }
  return ranks;
}

/** Sizes of the groups of equal values (only groups of two or more). */
export function tieGroups(values: readonly number[]): number[] {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return [...counts.values()].filter((n) => n > 1);
}
