import { cmuSyllableTable } from './cmu-syllables.ts';
import { estimateSyllables } from './syllable-features.ts';
import model from './syllable-model.json' with { type: 'json' };

let weights: Map<string, number> | null = null;

function fallbackWeights(): Map<string, number> {
  weights ??= new Map(Object.entries(model.features as Record<string, number>));
  return weights;
}

const VOWEL_GROUPS = /[aeiouy]+/g;

/**
 * Syllables in a word: the CMU Pronouncing Dictionary's first pronunciation when the word is
 * listed, for a hyphenated compound it lacks the sum of its parts, otherwise the fallback model trained on CMU (see build-syllable-model.ts). Letters
 * outside a–z are ignored for the fallback; a word with no letters has 0 syllables, any other
 * at least 1. `useDictionary: false` measures the fallback alone.
 *
 * @example
 * syllablesOf('safety') // 2 (CMU: S EY1 F T IY0)
 */
export function syllablesOf(word: string, options: { useDictionary?: boolean } = {}): number {
  const lower = word.toLowerCase();
  if (options.useDictionary !== false) {
    const known = cmuSyllableTable().get(lower) ?? estimated.get(lower);
    if (known !== undefined) return known;
    // a hyphenated compound CMU lacks: the sum of its parts ("rain-soaked" = rain + soaked)
    const guess = lower.includes('-') && lower.length <= 64 ? compound(lower) : fallback(lower);
    if (lower.length <= 64) {
      if (estimated.size >= 100_000) estimated.clear();
      estimated.set(lower, guess);
    }
    return guess;
  }
  return fallback(lower);
}

function compound(lower: string): number {
  let total = 0;
  for (const part of lower.split('-')) if (part) total += syllablesOf(part);
  return total > 0 ? total : fallback(lower);
}

/** Fallback estimates already made, for words CMU lacks. */
const estimated = new Map<string, number>();

function fallback(lower: string): number {
  const letters = lower.normalize('NFD').replace(/[^a-z]/g, '');
  if (letters.length === 0) return /\p{L}/u.test(lower) ? 1 : 0;
  // Beyond any real word's length the model's features mean nothing; count vowel groups.
  if (letters.length > 40) return Math.max(1, letters.match(VOWEL_GROUPS)?.length ?? 1);
  return estimateSyllables(letters, fallbackWeights());
}
