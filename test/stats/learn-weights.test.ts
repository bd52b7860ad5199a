import { describe, expect, it } from 'vitest';
import { loadRubric } from '../../src/rubric/load.ts';
import { rubricSourceWithWeights } from '../../src/rubric/with-weights.ts';
import { learnWeights } from '../../src/stats/learn-weights.ts';
import type { CalibrationItem } from '../../src/stats/calibration.ts';
import { seededRandom } from '../../src/stats/seeded-random.ts';

const source = `# a comment that must survive
id: t
title: T
criteria:
  - id: useful   # the one people care about
    check: non-answer
    weight: 1
  - id: noise
    check: format
    weight: 3
`;
const rubric = loadRubric(source).rubric!;

describe('learned weights', () => {
  it('find the criterion that decides and beat the present weights on held-out pairs', () => {
    const random = seededRandom(11);
    const items: CalibrationItem[] = Array.from({ length: 60 }, () => {
      const useful = { a: random(), b: random(), c: random() };
      const noise = { a: random(), b: random(), c: random() };
      const order = (['a', 'b', 'c'] as const).slice().sort((x, y) => useful[y] - useful[x]);
      return { final: Object.fromEntries(order.map((id, i) => [id, i + 1])), suggested: {}, criteria: { useful, noise }, lengths: {}, reviews: [] };
    });
    const learned = learnWeights(rubric, items);
    expect(learned.pairs).toBe(180);
    expect(learned.raw.useful).toBeGreaterThan(Math.abs(learned.raw.noise) * 3);
    expect(learned.fittedAccuracy!).toBeGreaterThan(learned.currentAccuracy!);
    expect(learned.suggested.useful + learned.suggested.noise).toBeCloseTo(4, 1);
  });

  it('are written into the rubric text with comments and layout kept', () => {
    const draft = rubricSourceWithWeights(source, { useful: 3.5, noise: 0.5 });
    expect(draft).toContain('# a comment that must survive');
    expect(draft).toContain('# the one people care about');
    const loaded = loadRubric(draft).rubric!;
    expect(loaded.criteria.map((c) => c.weight)).toEqual([3.5, 0.5]);
  });
});
