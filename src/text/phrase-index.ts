import type { Doc, MatchWord } from './analyze.ts';

/** A phrase's words, normalised; the last (or only) word may be a prefix (`ventilat*`). */
interface Entry {
  words: string[];
  prefixLast: boolean;
}

const NONE: readonly never[] = [];

const PUNCTUATION_EDGES = /^[\s"“”‘(\[{.,;:!?]+|[\s"“”’)\]}.,;:!?]+$/g;

/** Normalises a word for matching: lower case, straight apostrophes, no punctuation at its edges. */
export function normaliseWord(word: string): string {
  return word.toLowerCase().replace(/’/g, "'").replace(PUNCTUATION_EDGES, '');
}

/**
 * Phrases compiled for matching against a document's words (`doc.words`): a map from first word
 * to phrases, plus phrases whose first word is a prefix. Matching is linear in the words and does
 * not depend on how many phrases there are. Punctuation between words is ignored, so
 * "I am sorry, but I" matches the phrase "i am sorry but i".
 */
export class PhraseIndex {
  private readonly byFirst = new Map<string, Entry[]>();
  /** Single-word prefix phrases, by their first two letters. */
  private readonly prefixFirst = new Map<string, { prefix: string; entry: Entry }[]>();
  private readonly cache = new WeakMap<readonly MatchWord[], [number, number][]>();
  readonly size: number;

  constructor(phrases: readonly string[]) {
    let size = 0;
    for (const phrase of phrases) {
      const prefixLast = phrase.trim().endsWith('*');
      const words = phrase.trim().replace(/\*$/, '').split(/\s+/).map(normaliseWord).filter(Boolean);
      if (!words.length) continue;
      size++;
      const entry = { words, prefixLast };
      if (prefixLast && words.length === 1) {
        const head = words[0].slice(0, 2);
        const list = this.prefixFirst.get(head);
        if (list) list.push({ prefix: words[0], entry });
        else this.prefixFirst.set(head, [{ prefix: words[0], entry }]);
      }
      else {
        const list = this.byFirst.get(words[0]);
        if (list) list.push(entry);
        else this.byFirst.set(words[0], [entry]);
      }
    }
    this.size = size;
  }

  /**
   * Every match in `words[from, to)`, longest first at each start, not overlapping. A match never
   * crosses a sentence boundary. Returns [first word index, last word index] pairs.
   */
  matchWords(words: readonly MatchWord[], from = 0, to = words.length): [number, number][] {
    const whole = from === 0 && to === words.length;
    const cached = whole ? this.cache.get(words) : undefined;
    if (cached) return cached;
    const out: [number, number][] = [];
    const prefixes = this.prefixFirst.size > 0;
    for (let i = from; i < to; i++) {
      const w = words[i];
      let best = -1;
      const entries = this.byFirst.get(w.norm);
      if (entries) {
        for (const entry of entries) {
          const last = this.matchAt(words, i, to, entry);
          if (last > best) best = last;
        }
      }
      if (best < i && prefixes) for (const p of this.prefixFirst.get(w.head) ?? NONE) if (w.norm.startsWith(p.prefix)) best = i;
      if (best >= i) {
        out.push([i, best]);
        i = best;
      }
    }
    if (whole) this.cache.set(words, out);
    return out;
  }

  private matchAt(words: readonly MatchWord[], i: number, to: number, entry: Entry): number {
    const n = entry.words.length;
    if (i + n > to) return -1;
    const sentence = words[i].sentence;
    for (let k = 0; k < n; k++) {
      const w = words[i + k];
      if (w.sentence !== sentence) return -1;
      const want = entry.words[k];
      if (k === n - 1 && entry.prefixLast ? !w.norm.startsWith(want) : w.norm !== want) return -1;
    }
    return i + n - 1;
  }

  /** Matches in a document as character spans of the original text. */
  find(doc: Doc): { start: number; end: number }[] {
    return this.matchWords(doc.words).map(([a, b]) => ({ start: doc.words[a].start, end: doc.words[b].end }));
  }
}

const compiled = new WeakMap<readonly string[], PhraseIndex>();

/** The index for a phrase list, built once per list object. */
export function phraseIndex(phrases: readonly string[]): PhraseIndex {
  let index = compiled.get(phrases);
  if (!index) {
    index = new PhraseIndex(phrases);
    compiled.set(phrases, index);
  }
  return index;
}
