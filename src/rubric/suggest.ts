/** Optimal string alignment distance (Damerau–Levenshtein with adjacent transpositions). */
export function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j++) d[0][j] = j;
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

/**
 * The known name closest to a misspelt one, for "did you mean" — or undefined when nothing is
 * close (more than a third of the letters, and more than 3 edits, away).
 *
 * @example
 * closest('repitition', ['repetition', 'refusal']) // 'repetition'
 */
export function closest(name: string, known: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const k of known) {
    const distance = editDistance(name.toLowerCase(), k.toLowerCase());
    if (distance < bestDistance) [best, bestDistance] = [k, distance];
  }
  return best !== undefined && bestDistance <= Math.min(3, Math.max(1, Math.ceil(name.length / 3))) ? best : undefined;
}
