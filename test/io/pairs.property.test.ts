import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { pairsOf, rankingOf, type DecidedItem } from '../../src/io/export-decisions.ts';

/** A decided item with K responses and any final ranking, ties included (rank = 1 + how many rank above). */
const decided = fc.integer({ min: 2, max: 9 }).chain((k) =>
  fc.array(fc.integer({ min: 1, max: k }), { minLength: k, maxLength: k }).map((scores): DecidedItem => {
    const ids = Array.from({ length: k }, (_, i) => `r${i}`);
    const ranking = Object.fromEntries(ids.map((id, i) => [id, 1 + scores.filter((s) => s < scores[i]).length]));
    return {
      batch: 'b', promptId: 'p', prompt: 'q', responses: ids.map((id) => ({ responseId: id, text: `text of ${id}` })), ranking,
      decidedBy: 'adjudication', decidedAt: '2026-12-01T00:00:00Z', reviewers: ['rv_a', 'rv_b'], agreement: 0.5, rubric: { id: 'general', version: 'v' }, rationale: 'because', reviewRationales: [],
    };
  }),
);

describe('export pairs under generated rankings (fast-check)', () => {
  it('holds K(K−1)/2 pairs less the tied ones, each unordered pair once, the better-ranked first', () => {
    fc.assert(
      fc.property(decided, (item) => {
        const k = item.responses.length;
        const ranks = item.responses.map((r) => item.ranking[r.responseId]);
        let tied = 0;
        for (let i = 0; i < k; i++) for (let j = i + 1; j < k; j++) if (ranks[i] === ranks[j]) tied++;
        const strict = pairsOf(item, false);
        const all = pairsOf(item, true);
        expect(all).toHaveLength((k * (k - 1)) / 2);
        expect(strict).toHaveLength((k * (k - 1)) / 2 - tied);
        expect(all.filter((p) => p.tie)).toHaveLength(tied);
        expect(new Set(all.map((p) => [p.preferred_id, p.other_id].sort().join('|'))).size).toBe(all.length);
        for (const p of all) {
          expect(p.preferred_rank).toBeLessThanOrEqual(p.other_rank);
          expect(p.tie).toBe(p.preferred_rank === p.other_rank);
          expect(p.preferred_text).toBe(`text of ${p.preferred_id}`);
        }
        expect(rankingOf(item).responses).toHaveLength(k);
      }),
      { numRuns: 500 },
    );
  });
});
