import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

let table: Map<string, number> | null = null;

/** One entry of the dictionary's source: `  "word": "W ER1 D",`. */
const ENTRY = /^\s*"((?:[^"\\]|\\.)*)":\s*"([^"]*)"/;

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
 * built once on first use. The package's source is read as text, line by line, rather than
 * imported: importing it would keep an object of 134,000 properties alive in every thread
 * (about 90 MB each); the table alone takes a tenth of that.
 */
export function cmuSyllableTable(): Map<string, number> {
  if (table) return table;
  const source = readFileSync(createRequire(import.meta.url).resolve('cmu-pronouncing-dictionary'), 'utf8');
  table = new Map();
  for (const line of source.split('\n')) {
    const match = ENTRY.exec(line);
    if (!match) continue;
    const word = match[1].includes('\\') ? (JSON.parse(`"${match[1]}"`) as string) : match[1];
    if (!word.endsWith(')')) table.set(word, countStressDigits(match[2]));
  }
  if (table.size < 100_000) throw new Error(`the CMU Pronouncing Dictionary read as ${table.size} words; expected about 134,000 — reinstall cmu-pronouncing-dictionary`);
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
