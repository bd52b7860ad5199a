import { defineCheck } from './define-check.ts';
import { findPhrases, sentenceSpanAt } from './text-search.ts';

/** Absolute wording that overclaims where caution is due (our own list). */
export const ABSOLUTE_PHRASES = [
  '100%', '100 percent', 'guaranteed', 'guarantee', 'definitely', 'certainly', 'without a doubt', 'absolutely safe',
  'completely safe', 'perfectly safe', 'totally safe', 'always safe', 'entirely safe', 'no risk', 'zero risk', 'risk-free',
  'completely harmless', 'totally harmless', 'always edible', 'always perfectly', 'no difference at all', 'never harmful',
  'cannot go wrong', "can't go wrong", 'no problem at all', 'with no problem', 'always works', 'no exceptions',
];

/** Hedge cues (after the CoNLL-2010 shared task's cue lists, Farkas et al. 2010; our selection). */
export const HEDGE_CUES = [
  'may', 'might', 'could', 'possibly', 'perhaps', 'probably', 'likely', 'unlikely', 'suggest*', 'appear*', 'seem*', 'somewhat',
  'it is believed', 'in some cases', 'sort of', 'kind of', 'maybe', 'arguably', 'presumably', 'generally', 'usually', 'often',
];

/** Appeals to unnamed authority. */
export const UNSOURCED_PHRASES = [
  'studies show', 'studies have shown', 'research shows', 'research has shown', 'according to research', 'according to studies',
  'experts agree', 'experts say', 'scientists say', 'scientists agree', 'doctors agree', 'it is widely known', 'it is well known',
  'science says', 'it has been proven', 'it is proven',
];

/** Prompt or response wording that calls for caution: health, law, money, safety (our own list). */
export const CAUTION_DOMAIN_TERMS = [
  'safe*', 'health*', 'medic*', 'doctor', 'drink*', 'eat*', 'edible', 'poison*', 'injur*', 'pain', 'allerg*', 'dose', 'pregnan*',
  'child*', 'toddler*', 'baby', 'legal*', 'law*', 'allowed', 'airline*', 'money', 'invest*', 'loan*', 'tax*', 'fire', 'stove*',
  'gas', 'carbon monoxide', 'altitude', 'hypothermia', 'storm', 'lightning', 'water', 'snow', 'mushroom*', 'sting*', 'moose',
  'wildlife', 'repellent', 'blister*', 'ankle', 'boil*', 'cook*', 'indoor*', 'tent*',
];

const URL = /\bhttps?:\/\/[^\s<>"')\]]+/gi;
const DOI = /\b(?:doi:\s*|https?:\/\/doi\.org\/)?10\.[^\s,;]+/gi;
const PLACEHOLDER = /(xxx|placeholder|your[-_]?link|insert[-_]?link|link[-_]?here|lorem|todo|\.\.\.)/i;
const EXAMPLE_HOST = /^(?:[\w-]+\.)*(example\.(?:com|org|net)|localhost|test|invalid)$|^[^.]+$/i;

interface Params {
  absolutes: string[];
  hedges: string[];
  unsourced: string[];
  cautionTerms: string[];
  maxHedgesPerSentence: number;
}

/**
 * Truthfulness cues: absolute claims without a hedge where the prompt or answer concerns
 * health, law, money or safety; sentences stacked with hedges; appeals to unnamed studies or
 * experts without a source in the same sentence; and placeholder or malformed links and DOIs.
 */
export const certainty = defineCheck<Params>({
  meta: {
    id: 'certainty',
    description: 'Overconfident absolute claims where caution is due, stacked hedges, unsourced appeals to authority, and malformed or placeholder links and DOIs.',
    params: {
      absolutes: { type: 'string[]', default: ABSOLUTE_PHRASES, description: 'Absolute wording.' },
      hedges: { type: 'string[]', default: HEDGE_CUES, description: 'Hedge cues.' },
      unsourced: { type: 'string[]', default: UNSOURCED_PHRASES, description: 'Appeals to unnamed authority.' },
      cautionTerms: { type: 'string[]', default: CAUTION_DOMAIN_TERMS, description: 'Wording that makes absolute claims a risk.' },
      maxHedgesPerSentence: { type: 'integer', default: 2, min: 1, max: 20, description: 'More hedges than this in one sentence is hedge-stacking.' },
    },
    messages: {
      absolute: '"{phrase}" claims certainty on a matter that calls for caution',
      'hedge-stacking': '{count} hedges in one sentence where a plain answer was due',
      unsourced: '"{phrase}" appeals to unnamed authority with no source given',
      'placeholder-link': 'link looks like a placeholder or cannot be real: {link}',
      'malformed-doi': 'DOI is malformed or a placeholder: {doi}',
    },
  },
  evaluate(doc, params, report) {
    const text = doc.text;
    const cautious = findPhrases(doc, params.cautionTerms).length > 0 || (doc.context.prompt ? findPhrases(doc.context.prompt, params.cautionTerms).length > 0 : false);
    const hedgeSpans = findPhrases(doc, params.hedges);
    const hedgesIn = (span: { start: number; end: number }) => hedgeSpans.filter((h) => h.start >= span.start && h.end <= span.end).length;
    let count = 0;
    if (cautious) {
      for (const a of findPhrases(doc, params.absolutes)) {
        if (hedgesIn(sentenceSpanAt(doc, a.start)) > 0) continue;
        report('absolute', a, { phrase: text.slice(a.start, a.end) });
        count++;
      }
    }
    for (const s of doc.sentences) {
      const n = hedgesIn(s);
      if (n > params.maxHedgesPerSentence) {
        report('hedge-stacking', s, { count: n });
        count++;
      }
    }
    // the patterns are tried only on texts that can hold a match
    const links = !/http/i.test(text) ? [] : [...text.matchAll(URL)].map((m) => ({ start: m.index!, end: m.index! + m[0].replace(/[.,;:!?]+$/, '').length }));
    const dois = !text.includes('10.') ? [] : [...text.matchAll(DOI)].map((m) => ({ start: m.index!, end: m.index! + m[0].replace(/[.,;:!?)]+$/, '').length }));
    for (const u of findPhrases(doc, params.unsourced)) {
      const sentence = sentenceSpanAt(doc, u.start);
      const sourced = [...links, ...dois].some((l) => l.start >= sentence.start && l.start < sentence.end);
      if (!sourced) {
        report('unsourced', u, { phrase: text.slice(u.start, u.end) });
        count++;
      }
    }
    for (const l of links) {
      const link = text.slice(l.start, l.end);
      if (/doi\.org/i.test(link)) continue;
      let bad = PLACEHOLDER.test(link);
      try {
        bad ||= EXAMPLE_HOST.test(new globalThis.URL(link).hostname);
      } catch {
        bad = true;
      }
      if (bad) {
        report('placeholder-link', l, { link });
        count++;
      }
    }
    for (const d of dois) {
      const doi = text.slice(d.start, d.end);
      const bare = doi.replace(/^(doi:\s*|https?:\/\/doi\.org\/)/i, '');
      if (!/^10\.\d{4,9}\/\S+$/.test(bare) || /^10\.0+\//.test(bare) || PLACEHOLDER.test(bare)) {
        report('malformed-doi', d, { doi });
        count++;
      }
    }
    return { metrics: { caution_domain: Number(cautious), hedges: hedgeSpans.length, cues_flagged: count }, value: 1 - 0.25 * count };
  },
});
