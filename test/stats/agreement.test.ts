import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { alpha as referenceAlpha } from 'krippendorff';
import { sampleCorrelation, sampleRankCorrelation } from 'simple-statistics';
import { krippendorffAlpha, type Units } from '../../src/stats/krippendorff-alpha.ts';
import { cohenKappa, fleissKappa } from '../../src/stats/kappa.ts';
import { kendallTauB, kendallW, pearson, spearmanRho } from '../../src/stats/rank-correlation.ts';
import { averageRanks } from '../../src/stats/average-ranks.ts';
import { bootstrapInterval } from '../../src/stats/bootstrap.ts';

// Krippendorff (2011), "Computing Krippendorff's Alpha-Reliability": 4 observers × 12 units, '.' missing.
const U = undefined;
const observers = [
  [1, 2, 3, 3, 2, 1, 4, 1, 2, U, U, U],
  [1, 2, 3, 3, 2, 2, 4, 1, 2, 5, U, 3],
  [U, 3, 3, 3, 2, 3, 4, 2, 2, 5, 1, U],
  [1, 2, 3, 3, 2, 4, 4, 1, 2, 5, 1, U],
];
const units: Units = observers[0].map((_, u) => observers.map((o) => o[u]).filter((v): v is number => v !== undefined));

describe("Krippendorff's alpha on Krippendorff (2011)'s reliability data", () => {
  const expected: [Parameters<typeof krippendorffAlpha>[1], number][] = [
    ['nominal', 0.743],
    ['ordinal', 0.815],
    ['interval', 0.849],
    ['ratio', 0.797],
  ];
  for (const [level, value] of expected) {
    it(`${level} → ${value} (Krippendorff 2011)`, () => expect(krippendorffAlpha(units, level).value).toBeCloseTo(value, 3));
  }
});

describe('agreement with the npm reference packages on 300 random data sets', () => {
  const data = fc
    .record({ raters: fc.integer({ min: 2, max: 5 }), units: fc.integer({ min: 2, max: 15 }), values: fc.integer({ min: 2, max: 6 }), seed: fc.integer() })
    .chain(({ raters, units, values }) => fc.array(fc.array(fc.option(fc.integer({ min: 1, max: values }), { freq: 5 }), { minLength: units, maxLength: units }), { minLength: raters, maxLength: raters }));
  it('nominal, interval and ratio alpha match npm krippendorff (its pairwise distance functions)', () => {
    fc.assert(
      fc.property(data, (matrix) => {
        const rows = matrix.map((r) => r.map((v) => (v === null ? undefined : v)));
        rows[0] = rows[0].map((v) => v ?? undefined); // the package reads the unit count from the first row
        const asUnits: Units = rows[0].map((_, u) => rows.map((r) => r[u]).filter((v): v is number => v !== undefined));
        const metrics: [Parameters<typeof krippendorffAlpha>[1], (a: number, b: number) => number][] = [
          ['nominal', (a, b) => (a === b ? 0 : 1)],
          ['interval', (a, b) => (a - b) ** 2],
          ['ratio', (a, b) => ((a - b) / (a + b)) ** 2],
        ];
        for (const [level, metric] of metrics) {
          const ours = krippendorffAlpha(asUnits, level).value;
          const theirs = referenceAlpha(rows as (number | undefined)[][], metric as never);
          if (ours === null) expect(Number.isFinite(theirs)).toBe(false);
          else expect(Math.abs(ours - theirs)).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 300, seed: 2011 },
    );
  });

  it('Pearson and Spearman (tie-free data) match simple-statistics', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: -1000, max: 1000 }), { minLength: 3, maxLength: 40 }), fc.integer(), (x, seed) => {
        const y = x.map((v, i) => v * ((seed % 7) - 3) + ((i * 7919 + seed) % 101));
        if (new Set(y).size !== y.length || new Set(x).size !== x.length) return; // ties (0 and -0 included): simple-statistics ranks ties by position
        const p = pearson(x, y).value;
        if (p !== null) expect(Math.abs(p - sampleCorrelation(x, y))).toBeLessThan(1e-9);
        const s = spearmanRho(x, y).value;
        if (s !== null) expect(Math.abs(s - sampleRankCorrelation(x, y))).toBeLessThan(1e-9);
      }),
      { numRuns: 300, seed: 1904 },
    );
  });
});

describe('kappa (REFERENCES.md)', () => {
  it("Cohen's kappa on [[20,5],[10,15]] → pₒ 0.70, pₑ 0.50, κ 0.40 (a standard textbook example)", () => {
    const a = [...Array(25).fill('yes'), ...Array(25).fill('no')];
    const b = [...Array(20).fill('yes'), ...Array(5).fill('no'), ...Array(10).fill('yes'), ...Array(15).fill('no')];
    const k = cohenKappa(a, b);
    expect(k.observed).toBeCloseTo(0.7, 10);
    expect(k.chance).toBeCloseTo(0.5, 10);
    expect(k.value).toBeCloseTo(0.4, 10);
  });
  it("Fleiss' kappa on the 10 × 14 example → P̄ 0.378, P̄ₑ 0.213, κ 0.210 (Fleiss 1971, as widely reproduced)", () => {
    const table = [[0, 0, 0, 0, 14], [0, 2, 6, 4, 2], [0, 0, 3, 5, 6], [0, 3, 9, 2, 0], [2, 2, 8, 1, 1], [7, 7, 0, 0, 0], [3, 2, 6, 3, 0], [2, 5, 3, 2, 2], [6, 5, 2, 1, 0], [0, 2, 2, 3, 7]];
    const k = fleissKappa(table);
    expect(k.observed).toBeCloseTo(0.378, 3);
    expect(k.chance).toBeCloseTo(0.213, 3);
    expect(k.value).toBeCloseTo(0.21, 3);
  });
});

describe('rank correlation (REFERENCES.md)', () => {
  it('Kendall tau-b: x = [12,2,1,12,2], y = [1,4,7,1,0] → −0.4714 (memory of SciPy\'s documented example; recomputed)', () => {
    expect(kendallTauB([12, 2, 1, 12, 2], [1, 4, 7, 1, 0]).value).toBeCloseTo(-0.4714, 4);
  });
  it('Spearman rho on average ranks: [1..5] vs [5,6,7,8,7] → 0.8208, not the no-ties shortcut\'s 0.825', () => {
    expect(spearmanRho([1, 2, 3, 4, 5], [5, 6, 7, 8, 7]).value).toBeCloseTo(0.8208, 4);
    expect(averageRanks([5, 6, 7, 8, 7])).toEqual([1, 2, 3.5, 5, 3.5]);
  });
  it("Kendall's W: perfect agreement is 1; ties use the correction (Kendall & Babington Smith 1939; Siegel & Castellan 1988)", () => {
    expect(kendallW([[1, 2, 3, 4], [1, 2, 3, 4], [1, 2, 3, 4]]).value).toBeCloseTo(1, 12);
    // three raters, one tie: S = 50, Σ T = 6 → W = 12·50 / (9·60 − 3·6) = 600 / 522 … computed from the formula
    const w = kendallW([[1, 2, 3, 4], [1, 2, 3, 3], [2, 1, 3, 4]]).value!;
    const ranks = [[1, 2, 3, 4], [1, 2, 3.5, 3.5], [2, 1, 3, 4]];
    const totals = [0, 1, 2, 3].map((i) => ranks.reduce((a, r) => a + r[i], 0));
    const S = totals.reduce((a, t) => a + (t - 7.5) ** 2, 0);
    expect(w).toBeCloseTo((12 * S) / (9 * 60 - 3 * 6), 12);
  });
});

describe('degenerate data gives a defined result or a reason, never NaN', () => {
  const cases: [string, () => { value: number | null; reason?: string }][] = [
    ['alpha with one rater', () => krippendorffAlpha([[1], [2], [3]], 'nominal')],
    ['alpha with one unit', () => krippendorffAlpha([[1, 2, 1]], 'interval')],
    ['alpha with all identical values', () => krippendorffAlpha([[2, 2], [2, 2]], 'ordinal')],
    ['alpha with no pairable values', () => krippendorffAlpha([], 'ratio')],
    ['Fleiss with uneven raters', () => fleissKappa([[1, 1], [2, 1]])],
    ['Fleiss with one category used', () => fleissKappa([[3, 0], [3, 0]])],
    ['Cohen with one shared label', () => cohenKappa(['a', 'a'], ['a', 'a'])],
    ['tau-b with a constant list', () => kendallTauB([1, 1, 1], [1, 2, 3])],
    ['Spearman with one pair', () => spearmanRho([1], [2])],
    ['W with one rater', () => kendallW([[1, 2, 3]])],
    ['W with all ties', () => kendallW([[1, 1], [1, 1]])],
  ];
  for (const [name, run] of cases) {
    it(name, () => {
      const result = run();
      if (result.value === null) expect(result.reason).toMatch(/\w/);
      else expect(Number.isFinite(result.value)).toBe(true);
    });
  }
  it('one unit with agreement gives a bootstrap interval, none for no units', () => {
    expect(bootstrapInterval([1, 1, 0, 1], (s) => s.reduce((a, b) => a + b, 0) / s.length, { rounds: 200 })).toMatchObject({ low: expect.any(Number), high: expect.any(Number) });
    expect(bootstrapInterval([], () => 1)).toBeNull();
  });
});
