import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/text/analyze.ts';
import { runAllChecks } from '../../src/checks/run-checks.ts';

function assertWellDefined(text: string) {
  const doc = analyze(text, { prompt: analyze('Explain to my 7-year-old how a compass works.') });
  const results = runAllChecks(doc);
  for (const [id, r] of Object.entries(results)) {
    expect(Number.isFinite(r.value), id).toBe(true);
    for (const [name, value] of Object.entries(r.metrics)) {
      if (typeof value === 'number') expect(Number.isFinite(value), `${id}.${name}`).toBe(true);
      if (value === null) expect(r.undefinedMetrics[name], `${id}.${name} is null without a reason`).toBeTruthy();
    }
    for (const f of r.findings) expect(text.slice(f.start, f.end)).toBe(f.evidence);
  }
  return results;
}

describe('degenerate input gives well-defined output', () => {
  const cases: [string, string][] = [
    ['empty', ''],
    ['whitespace only', ' \t\r\n  \n'],
    ['control characters', '\u0000\u0001\u0007\u001b[31m\u007f'],
    ['lone surrogates', '\ud800 abc \udfff \ud83d'],
    ['a single letter', 'a'],
    ['only punctuation', '?!.,;:'],
    ['one very long line', `${'word '.repeat(20_000)}`],
  ];
  for (const [name, text] of cases) it(name, () => assertWellDefined(text));

  it('the empty text has null readability formulas, each with a reason', () => {
    const r = assertWellDefined('').readability;
    expect(r.metrics.flesch_reading_ease).toBeNull();
    expect(r.undefinedMetrics.flesch_reading_ease).toBe('the text has no words');
  });

  it('a 1 MB "word" is analysed in time linear in its length', () => {
    const time = (n: number) => {
      const text = 'x'.repeat(n);
      const t0 = performance.now();
      assertWellDefined(text);
      return performance.now() - t0;
    };
    time(10_000);
    const small = Math.max(time(100_000), 5);
    const large = time(1_000_000);
    // ten times the length may cost at most fifteen times as much (with room for timer noise)
    expect(large).toBeLessThan(small * 15 + 200);
  });
});
