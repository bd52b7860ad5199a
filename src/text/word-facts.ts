import { daleChall as familiarList } from 'dale-chall';
import { stemOf } from './stem.ts';
import { syllablesOf } from './syllables.ts';
import { STOP_WORDS } from './word-lists.ts';

/**
 * A string that recurs across documents (a word form, a stem), numbered anew in each document
 * without hashing: `doc` is the serial of the document that last numbered it, `id` its number
 * there (see `numberSlot`).
 */
export interface Slot {
  doc: number;
  id: number;
}

/** Everything the analysis needs to know about a word form, worked out once per distinct form. */
export interface WordFacts {
  /** The slot of the lower-case word without its clitic ("do" of "don't"). */
  wordSlot: Slot;
  stem: string;
  stemSlot: Slot;
  syllables: number;
  stop: boolean;
  /** On the Dale–Chall familiar list, directly or as a regular inflection. */
  familiar: boolean;
  letters: number;
  /** Letters and digits (ARI). */
  characters: number;
  /** Reaches 3 syllables only through -es, -ed or -ing (not a Gunning complex word). */
  complexByInflectionOnly: boolean;
}

/**
 * Does a word of `syllables` syllables reach 3 only through -es, -ed or -ing? Gunning did not
 * count such words as complex.
 */
export function complexByInflectionOnly(lower: string, syllables: number): boolean {
  if (syllables < 3) return false;
  const suffix = /(es|ed|ing)$/.exec(lower);
  return suffix !== null && syllablesOf(lower.slice(0, -suffix[1].length)) < 3 && syllables - 1 < 3;
}

const FAMILIAR = new Set(familiarList.map((w) => w.toLowerCase()));

/**
 * A word is familiar (Dale–Chall) when it, or the base of a regular inflection of it, is on the
 * list: -s, -es, -ies→y, -ed, -d, -ied→y, -ing, -er, -est, -ly. Numbers count as familiar.
 */
export function isFamiliar(lower: string): boolean {
  if (FAMILIAR.has(lower) || /^[\d.,:]+$/.test(lower)) return true;
  const bases: string[] = [];
  if (lower.endsWith('ies') || lower.endsWith('ied')) bases.push(`${lower.slice(0, -3)}y`);
  if (lower.endsWith('es') || lower.endsWith('ed') || lower.endsWith('er') || lower.endsWith('ly')) bases.push(lower.slice(0, -2));
  if (lower.endsWith('s') || lower.endsWith('d')) bases.push(lower.slice(0, -1));
  if (lower.endsWith('ing')) bases.push(lower.slice(0, -3), `${lower.slice(0, -3)}e`);
  if (lower.endsWith('est')) bases.push(lower.slice(0, -3));
  if (lower.endsWith('ier') || lower.endsWith('iest')) bases.push(`${lower.replace(/iest$|ier$/, '')}y`);
  return bases.some((b) => b.length > 1 && FAMILIAR.has(b));
}

function countLetters(word: string): { letters: number; characters: number } {
  let letters = 0;
  let characters = 0;
  for (const ch of word) {
    const c = ch.codePointAt(0)!;
    const ascii = c < 128;
    const letter = ascii ? (c >= 65 && c <= 90) || (c >= 97 && c <= 122) : /\p{L}/u.test(ch);
    const digit = ascii ? c >= 48 && c <= 57 : /\p{N}/u.test(ch);
    if (letter) letters++;
    if (letter || digit) characters++;
  }
  return { letters, characters };
}

const cache = new Map<string, WordFacts>();
const wordSlots = new Map<string, Slot>();
const stemSlots = new Map<string, Slot>();
const CACHE_LIMIT = 200_000;

function slotOf(slots: Map<string, Slot>, text: string): Slot {
  let slot = slots.get(text);
  if (!slot) slots.set(text, (slot = { doc: 0, id: 0 }));
  return slot;
}

/**
 * Empties the memo once it holds CACHE_LIMIT forms. Called between documents only, so every
 * token of one document sees the same slots.
 */
export function trimWordFacts(): void {
  if (cache.size < CACHE_LIMIT) return;
  cache.clear();
  wordSlots.clear();
  stemSlots.clear();
}

/**
 * The number of `slot` in document `doc`: its number from earlier in the same document, or the
 * next one (`counter.next`) if the document has not met it yet.
 */
export function numberSlot(slot: Slot, doc: number, counter: { next: number }): number {
  if (slot.doc !== doc) {
    slot.doc = doc;
    slot.id = counter.next++;
  }
  return slot.id;
}

/**
 * Facts about a lowercase word form (with its clitic, as "don't"), memoised: the same forms
 * recur across responses, so each is worked out once (`trimWordFacts` bounds the memo).
 */
export function wordFacts(surfaceLower: string, stemBase = surfaceLower): WordFacts {
  const key = stemBase === surfaceLower ? surfaceLower : `${surfaceLower}\u0000${stemBase}`;
  let facts = cache.get(key);
  if (facts) return facts;
  const syllables = syllablesOf(surfaceLower);
  const stem = stemOf(stemBase);
  facts = {
    wordSlot: slotOf(wordSlots, stemBase),
    stem,
    stemSlot: slotOf(stemSlots, stem),
    syllables,
    stop: STOP_WORDS.has(stemBase),
    familiar: isFamiliar(surfaceLower.replace(/’/g, "'")),
    ...countLetters(surfaceLower),
    complexByInflectionOnly: complexByInflectionOnly(stemBase, syllables),
  };
  cache.set(key, facts);
  return facts;
}
