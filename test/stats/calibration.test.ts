import { describe, expect, it } from 'vitest';
import { calibrate, type CalibrationItem } from '../../src/stats/calibration.ts';

// Hand-made: final a > b > c; the suggested order swaps b and c; criterion "x" agrees fully,
// "y" ties everything; a is longest and c shortest; one reviewer saw c, b, a and ranked a > b > c
// blind, then revised to a > c > b after the reveal (toward the suggested order).
const item: CalibrationItem = {
  final: { a: 1, b: 2, c: 3 },
  suggested: { a: 1, b: 3, c: 2 },
  criteria: { x: { a: 0.9, b: 0.5, c: 0.1 }, y: { a: 1, b: 1, c: 1 } },
  lengths: { a: 300, b: 200, c: 100 },
  reviews: [{ reviewer: 'r1', displayOrder: ['c', 'b', 'a'], first: { a: 1, b: 2, c: 3 }, final: { a: 1, b: 3, c: 2 }, revealed: true }],
};

describe('calibration against final human rankings (values computed by hand)', () => {
  const result = calibrate([item]);
  it('suggested order: 2 of 3 pairs agree', () => expect(result.suggestedOrder).toEqual({ value: 2 / 3, pairs: 3 }));
  it('each criterion alone: x 3/3, y all ties count half', () => expect(result.criteria).toEqual({ x: { value: 1, pairs: 3 }, y: { value: 0.5, pairs: 3 } }));
  it('length bias: the longer response won all 3 pairs', () => expect(result.lengthBias).toEqual({ value: 1, pairs: 3 }));
  it('position bias: in the blind ranking, the earlier-shown response never won', () => expect(result.positionBias).toEqual({ value: 0, pairs: 3 }));
  it('anchoring: one revision, toward the suggested order', () => expect(result.anchoring).toEqual({ revisions: 1, towardSuggested: 1, share: 1 }));
  it("reviewer agreement with the decision: the revised ranking agrees on 2 of 3 pairs", () => expect(result.reviewers.r1.value).toBeCloseTo(2 / 3, 12));
  it('no items gives null shares, not NaN', () => {
    const empty = calibrate([]);
    expect(empty.suggestedOrder).toEqual({ value: null, pairs: 0 });
    expect(empty.anchoring.share).toBeNull();
  });
});
