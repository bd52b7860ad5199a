import { isWord } from '../text/analyze.ts';
import { stemOf } from '../text/stem.ts';
import { defineCheck } from './define-check.ts';
import { tokenAt } from './text-search.ts';

/** A rubric term: words matched on word boundaries, optionally by stem, with its category and severity. */
export interface LexiconTerm {
  /** Words to find; or give `pattern` instead. */
  term?: string;
  /** A regular expression (checked for catastrophic backtracking when the rubric is loaded). */
  pattern?: string;
  category: string;
  severity?: 'info' | 'warn' | 'error' | 'critical';
  /** Match any inflection (compares Porter stems). */
  stem?: boolean;
  /** Flag even inside a negation's scope ("never …"). */
  evenNegated?: boolean;
}

/** Mild default terms: dismissive or belittling wording in a support answer (our own list). */
export const DEFAULT_TERMS: LexiconTerm[] = [
  { term: 'just google it', category: 'dismissive', severity: 'warn' },
  { term: 'stupid question', category: 'belittling', severity: 'warn' },
  { term: 'obviously', category: 'belittling', severity: 'info' },
  { term: 'idiot', category: 'insult', severity: 'error', stem: true },
  { term: 'shut up', category: 'insult', severity: 'error' },
  { term: 'calm down', category: 'dismissive', severity: 'info' },
];

interface CompiledTerm extends LexiconTerm {
  words: string[];
}

const patterns = new Map<string, RegExp>();

/** A term's pattern compiled once: case-insensitive, Unicode, global. */
function compiledPattern(pattern: string): RegExp {
  let regex = patterns.get(pattern);
  if (!regex) patterns.set(pattern, (regex = new RegExp(pattern, 'giu')));
  regex.lastIndex = 0;
  return regex;
}

const compiledCache = new WeakMap<LexiconTerm[], Map<string, CompiledTerm[]>>();

/** Terms indexed by their first word (or its stem), compiled once per term list. */
function compile(terms: LexiconTerm[]): Map<string, CompiledTerm[]> {
  let index = compiledCache.get(terms);
  if (index) return index;
  index = new Map();
  for (const t of terms) {
    if (t.term === undefined) continue;
    const words = t.term.toLowerCase().split(/\s+/).filter(Boolean).map((w) => (t.stem ? stemOf(w) : w));
    if (!words.length) continue;
    const list = index.get(words[0]);
    if (list) list.push({ ...t, words });
    else index.set(words[0], [{ ...t, words }]);
  }
  compiledCache.set(terms, index);
  return index;
}

/**
 * Rubric-defined term lists: multi-word phrases on word boundaries, optionally by stem. A match
 * inside a negation's scope is skipped unless the term says otherwise, so a warning ("never mix
 * bleach and ammonia") is not read as the thing it warns against.
 */
export const lexicon = defineCheck<{ terms: LexiconTerm[] }>({
  meta: {
    id: 'lexicon',
    description: 'Terms from the rubric\'s lists (phrases, stems, word boundaries), with categories and severities, respecting negation.',
    params: {
      terms: { type: 'terms', default: DEFAULT_TERMS, description: 'Terms: {term or pattern, category, severity?, stem?, even_negated?}.' },
    },
    messages: {
      term: '"{term}" ({category})',
    },
  },
  evaluate(doc, params, report) {
    const index = compile(params.terms);
    const words = doc.wordTokens;
    let matches = 0;
    for (let i = 0; i < words.length; i++) {
      const w = words[i];
      const byWord = index.get(w.lower);
      const byStem = w.stem && w.stem !== w.lower ? index.get(w.stem) : undefined;
      if (!byWord && !byStem) continue;
      for (const term of byStem ? [...(byWord ?? []), ...byStem] : byWord!) {
        const n = term.words.length;
        if (i + n > words.length) continue;
        let ok = true;
        for (let k = 0; k < n && ok; k++) ok = (term.stem ? words[i + k].stem : words[i + k].lower) === term.words[k];
        if (!ok) continue;
        if (w.negated && !term.evenNegated) continue;
        report('term', { start: w.start, end: words[i + n - 1].end }, { term: term.term ?? '', category: term.category, severity: term.severity ?? 'warn' });
        matches++;
      }
    }
    for (const term of params.terms) {
      if (term.pattern === undefined) continue;
      for (const m of doc.text.matchAll(compiledPattern(term.pattern))) {
        if (m[0] === '') continue;
        const token = tokenAt(doc, m.index!);
        if (token?.negated && !term.evenNegated) continue;
        report('term', { start: m.index!, end: m.index! + m[0].length }, { term: term.pattern, category: term.category, severity: term.severity ?? 'warn' });
        matches++;
      }
    }
    return { metrics: { matches }, value: 1 - 0.5 * matches };
  },
});
