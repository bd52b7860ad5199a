import { contentStems, type Doc } from '../text/analyze.ts';
import type { Quantity } from '../text/quantities.ts';
import { defineCheck } from './define-check.ts';

function sentenceStems(doc: Doc, q: Quantity): Set<string> {
  const s = doc.sentences[q.sentence];
  return new Set(s ? contentStems(doc, s.firstToken, s.endToken).filter((stem) => !/^\d/.test(stem)) : []);
}

function overlaps(a: Quantity, b: Quantity, tolerance: number): boolean {
  return a.baseHigh >= b.base * (1 - tolerance) && b.baseHigh >= a.base * (1 - tolerance);
}

/**
 * Cross-candidate consistency: a quantity this response states (a time, distance, mass,
 * percentage …) that sibling responses to the same prompt state differently in the same
 * context (sharing a content stem). At most one of them can be right, so each is flagged for the
 * reviewer to check. Ranges overlap when they share any value.
 */
export const consistency = defineCheck<{ minShared: number; tolerance: number }>({
  meta: {
    id: 'consistency',
    description: 'Numbers, dates and quantities that other candidates to the same prompt state differently in the same context.',
    params: {
      minShared: { type: 'integer', default: 1, min: 1, max: 10, description: 'Content stems the two sentences must share.' },
      tolerance: { type: 'number', default: 0.1, min: 0, max: 1, description: 'Relative difference still taken as the same value.' },
    },
    messages: {
      disagrees: 'says {value}; {count} other candidate(s) say {others}',
    },
  },
  evaluate(doc, params, report) {
    const siblings = doc.context.siblings ?? [];
    if (!siblings.length) {
      return { metrics: { quantities_compared: null, disagreements: null }, value: 1, undefinedMetrics: { quantities_compared: 'no sibling responses', disagreements: 'no sibling responses' } };
    }
    const mine = doc.quantities.filter((q) => q.family && q.family !== 'money');
    let compared = 0;
    let disagreeing = 0;
    for (const q of mine) {
      const stems = sentenceStems(doc, q);
      const others: string[] = [];
      let comparable = false;
      for (const sib of siblings) {
        for (const s of sib.quantities) {
          if (s.family !== q.family) continue;
          const shared = [...sentenceStems(sib, s)].filter((x) => stems.has(x)).length;
          if (shared < params.minShared) continue;
          comparable = true;
          if (!overlaps(q, s, params.tolerance)) others.push(s.text);
        }
      }
      if (comparable) compared++;
      if (others.length) {
        disagreeing++;
        const distinct = [...new Set(others)];
        report('disagrees', q, { value: q.text, count: others.length, others: distinct.slice(0, 4).join(', ') });
      }
    }
    return { metrics: { quantities_compared: compared, disagreements: disagreeing }, value: compared ? 1 - disagreeing / compared : 1 };
  },
});
