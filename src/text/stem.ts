import { createRequire } from 'node:module';

// Only the Porter stemmer submodule: the root of `natural` loads .env files and prints.
const require = createRequire(import.meta.url);
const porter = require('natural/lib/natural/stemmers/porter_stemmer.js') as { stem(word: string): string };

const cache = new Map<string, string>();
const CACHE_LIMIT = 100_000;

/** The Porter stem of a lowercase word, memoised (the same words recur across responses). */
export function stemOf(lower: string): string {
  let stem = cache.get(lower);
  if (stem === undefined) {
    stem = lower.length > 40 ? lower : porter.stem(lower);
    if (cache.size >= CACHE_LIMIT) cache.clear();
    cache.set(lower, stem);
  }
  return stem;
}
