/**
 * Features of a lowercase a–z word for the syllable fallback model: each vowel group with its
 * left and right letters, the word's endings, and a bias. The model's estimate is the sum of the
 * weights of the features present, rounded, at least 1.
 */
const VOWEL_GROUP = /[aeiouy]+/g;

export function syllableFeatures(word: string): string[] {
  const features = ['B'];
  const padded = `^${word}$$`;
  for (const match of word.matchAll(VOWEL_GROUP)) {
    const group = match[0];
    const at = match.index! + 1; // index in padded
    const prev = padded[at - 1];
    const next = padded.slice(at + group.length, at + group.length + 2);
    features.push(`G:${group}`, `L:${prev}${group}`, `R:${group}${next}`, `LR:${prev}${group}${next}`);
    if (group.length >= 2) features.push(`GP:${prev}${group}${next[0]}`);
  }
  for (const n of [2, 3, 4]) if (word.length > n) features.push(`S${n}:${word.slice(-n)}`);
  for (const n of [2, 3]) if (word.length > n + 1) features.push(`P${n}:${word.slice(0, n)}`);
  return features;
}

/** The sum of the weights of a word's features, rounded, and never below 1. */
export function estimateSyllables(word: string, weights: ReadonlyMap<string, number>): number {
  let sum = 0;
  for (const f of syllableFeatures(word)) sum += weights.get(f) ?? 0;
  return Math.max(1, Math.round(sum));
}
