import { dictionary } from 'cmu-pronouncing-dictionary';

let table: Map<string, number> | null = null;

/** Syllables in a CMU pronunciation: the phonemes that carry a stress digit (0, 1 or 2). */
export function countStressDigits(pronunciation: string): number {
  let n = 0;
  for (let i = 0; i < pronunciation.length; i++) {
    const c = pronunciation.charCodeAt(i);
    if (c >= 48 && c <= 50) n++;
  }
  return n;
}

/**
 * Syllable counts of the CMU Pronouncing Dictionary's first pronunciation of each headword,
 * built once on first use (the dictionary is large; loading it costs about 0.2 s).
 */
export function cmuSyllableTable(): Map<string, number> {
  if (table) return table;
  table = new Map();
  for (const [word, pronunciation] of Object.entries(dictionary)) {
    if (!word.endsWith(')')) table.set(word, countStressDigits(pronunciation));
  }
  return table;
}

/** CMU's alphabetic headwords (a–z only, first pronunciations) with their syllable counts. */
export function cmuAlphabeticEntries(): [string, number][] {
  return [...cmuSyllableTable()].filter(([w]) => /^[a-z]+$/.test(w));
}

/** Deterministic split: a word is in the held-out tenth when its FNV-1a hash is 0 mod 10. */
export function isHeldOut(word: string): boolean {
  let h = 0x811c9dc5;
  for (let i = 0; i < word.length; i++) {
    h ^= word.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h % 10 === 0;
}
