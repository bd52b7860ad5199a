import type { Doc, MatchWord } from './analyze.ts';

/** A phrase's words, normalised; the last (or only) word may be a prefix (`ventilat*`). */
interface Entry {
  /** The list (PhraseIndex) the phrase belongs to. */
  list: number;
  words: string[];
  prefixLast: boolean;
}

type Matches = [number, number][];

const PUNCTUATION_EDGES = /^[\s"“”‘(\[{.,;:!?]+|[\s"“”’)\]}.,;:!?]+$/g;

/** Normalises a word for matching: lower case, straight apostrophes, no punctuation at its edges. */
export function normaliseWord(word: string): string {
  return word.toLowerCase().replace(/’/g, "'").replace(PUNCTUATION_EDGES, '');
}

function entriesOf(phrases: readonly string[], list: number): Entry[] {
  const entries: Entry[] = [];
  for (const phrase of phrases) {
    const prefixLast = phrase.trim().endsWith('*');
    const words = phrase.trim().replace(/\*$/, '').split(/\s+/).map(normaliseWord).filter(Boolean);
    if (words.length) entries.push({ list, words, prefixLast });
  }
  return entries;
}

/** Does `entry` match at word `i`? Returns the index of its last word, or −1. Never crosses a sentence. */
function matchAt(words: readonly MatchWord[], i: number, entry: Entry): number {
  const n = entry.words.length;
  if (i + n > words.length) return -1;
  const sentence = words[i].sentence;
  for (let k = 0; k < n; k++) {
    const w = words[i + k];
    if (w.sentence !== sentence) return -1;
    const want = entry.words[k];
    if (k === n - 1 && entry.prefixLast ? !w.norm.startsWith(want) : w.norm !== want) return -1;
  }
  return i + n - 1;
}

/**
 * Phrases of many lists compiled into one index: a map from first word to phrases, plus
 * single-word prefix phrases by their first two letters. One pass over a document's words finds
 * the matches of every list at once, so adding a list costs a few map entries rather than
 * another pass. Per list, matches are longest first at each start and do not overlap.
 */
class PhraseBank {
  private readonly byFirst = new Map<string, Entry[]>();
  /**
   * Single-word prefix phrases by the low bytes of their first two characters (see `headSlot`):
   * one array read per word, no map. Characters beyond Latin-1 may share a slot, so a candidate
   * is still checked with `startsWith`.
   */
  private readonly prefixByHead: (Entry[] | undefined)[] = new Array(65536).fill(undefined);
  lists = 0;

  add(entries: Entry[]): void {
    for (const entry of entries) {
      if (entry.prefixLast && entry.words.length === 1) {
        const slot = headSlot(entry.words[0]);
        (this.prefixByHead[slot] ??= []).push(entry);
        continue;
      }
      const list = this.byFirst.get(entry.words[0]);
      if (list) list.push(entry);
      else this.byFirst.set(entry.words[0], [entry]);
    }
    this.lists++;
  }

  /** Matches of each list in `words`, indexed by list number: [first word, last word] pairs. */
  scan(words: readonly MatchWord[]): Matches[] {
    const lists = this.lists;
    const out: Matches[] = Array.from({ length: lists }, () => []);
    const nextFree = new Int32Array(lists);
    const best = new Int32Array(lists).fill(-1);
    const touched: number[] = [];
    const consider = (i: number, entry: Entry, last: number) => {
      if (last < 0 || i < nextFree[entry.list]) return;
      if (best[entry.list] < 0) touched.push(entry.list);
      if (last > best[entry.list]) best[entry.list] = last;
    };
    for (let i = 0; i < words.length; i++) {
      const w = words[i];
      const entries = this.byFirst.get(w.norm);
      if (entries) for (const entry of entries) if (i >= nextFree[entry.list]) consider(i, entry, matchAt(words, i, entry));
      const prefixes = this.prefixByHead[headSlot(w.norm)];
      if (prefixes) for (const entry of prefixes) if (w.norm.startsWith(entry.words[0])) consider(i, entry, i);
      if (!touched.length) continue;
      for (const list of touched) {
        out[list].push([i, best[list]]);
        nextFree[list] = best[list] + 1;
        best[list] = -1;
      }
      touched.length = 0;
    }
    return out;
  }
}

/** The low bytes of a word's first two characters as one 16-bit number (a word of one character: its low byte). */
function headSlot(word: string): number {
  return word.length > 1 ? ((word.charCodeAt(0) & 0xff) << 8) | (word.charCodeAt(1) & 0xff) : word.charCodeAt(0) & 0xff;
}

/** Lists a bank takes; lists beyond it (rubrics can make many) get a bank of their own. */
const SHARED_LISTS = 256;

const shared = new PhraseBank();

/**
 * What has been matched in one document's words, kept on the words array itself (under a
 * symbol) so that it goes when the document goes: weak maps keyed by document would cost every
 * garbage collection a look at each entry.
 */
interface WordsMemo {
  scan?: { lists: number; matches: Matches[] };
  own?: Map<PhraseIndex, Matches>;
  spans?: Map<PhraseIndex, { start: number; end: number }[]>;
}
const MEMO = Symbol('phrase matches');

function memoOf(words: readonly MatchWord[]): WordsMemo {
  const holder = words as readonly MatchWord[] & { [MEMO]?: WordsMemo };
  return (holder[MEMO] ??= {});
}

/** Every shared list's matches in `words`, scanned once; rescanned if lists were added since. */
function sharedMatches(words: readonly MatchWord[]): Matches[] {
  const memo = memoOf(words);
  if (!memo.scan || memo.scan.lists !== shared.lists) memo.scan = { lists: shared.lists, matches: shared.scan(words) };
  return memo.scan.matches;
}

/**
 * A phrase list compiled for matching against a document's words (`doc.words`). Matching does
 * not depend on how many phrases there are, and a document is scanned once for every list in
 * the shared bank. Punctuation between words is ignored, so "I am sorry, but I" matches the
 * phrase "i am sorry but i".
 */
export class PhraseIndex {
  private readonly bank: PhraseBank;
  private readonly list: number;
  readonly size: number;

  constructor(phrases: readonly string[]) {
    const useShared = shared.lists < SHARED_LISTS;
    this.bank = useShared ? shared : new PhraseBank();
    this.list = useShared ? shared.lists : 0;
    const entries = entriesOf(phrases, this.list);
    this.size = entries.length;
    this.bank.add(entries);
  }

  /** Every match in `words`, longest first at each start, not overlapping, never across a sentence: [first word, last word] pairs. */
  matchWords(words: readonly MatchWord[]): Matches {
    if (this.bank === shared) return sharedMatches(words)[this.list];
    const own = (memoOf(words).own ??= new Map());
    let matches = own.get(this);
    if (!matches) {
      matches = this.bank.scan(words)[0];
      own.set(this, matches);
    }
    return matches;
  }

  /** Matches in a document as character spans of the original text. */
  find(doc: Doc): { start: number; end: number }[] {
    const all = (memoOf(doc.words).spans ??= new Map());
    let spans = all.get(this);
    if (!spans) {
      spans = this.matchWords(doc.words).map(([a, b]) => ({ start: doc.words[a].start, end: doc.words[b].end }));
      all.set(this, spans);
    }
    return spans;
  }
}

const compiled = new WeakMap<readonly string[], PhraseIndex>();
const byContent = new Map<string, PhraseIndex>();

/**
 * The index for a phrase list, built once per list object and shared by lists with the same
 * phrases (a rubric that repeats a default list, or is loaded again, adds nothing to the bank).
 */
export function phraseIndex(phrases: readonly string[]): PhraseIndex {
  let index = compiled.get(phrases);
  if (!index) {
    const key = phrases.join('\n');
    index = byContent.get(key);
    if (!index) {
      index = new PhraseIndex(phrases);
      if (byContent.size < 4096) byContent.set(key, index);
    }
    compiled.set(phrases, index);
  }
  return index;
}
