import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/text/analyze.ts';

/**
 * Numbers the analysis reads, with what it makes of them. Unit factors are SI and common
 * conversions (common practice); the texts are written for this project.
 */
const CASES: { text: string; want: { text: string; kind: string; value: number; high?: number; family?: string | null; base?: number }[] }[] = [
  { text: 'Boil it for 1 minute.', want: [{ text: '1 minute', kind: 'quantity', value: 1, family: 'time', base: 60 }] },
  { text: 'Boil it for ten minutes.', want: [{ text: 'ten minutes', kind: 'quantity', value: 10, family: 'time', base: 600 }] },
  { text: 'Walk 300 to 500 metres.', want: [{ text: '300 to 500 metres', kind: 'quantity', value: 300, high: 500, family: 'length', base: 300 }] },
  { text: 'It weighs 1.2 kg.', want: [{ text: '1.2 kg', kind: 'quantity', value: 1.2, family: 'mass', base: 1200 }] },
  { text: 'Meet at 14:30 on 12 March 2024.', want: [{ text: '14:30', kind: 'time', value: 14.5 }, { text: '12 March 2024', kind: 'date', value: 0 }] },
  // words that are properties of every JavaScript object are no numbers
  { text: 'The constructor hours and toString minutes.', want: [] },
  { text: 'one of the hikers', want: [] },
];

describe('quantities', () => {
  it.each(CASES)('$text', ({ text, want }) => {
    const found = analyze(text).quantities.map((q) => ({ text: q.text, kind: q.kind, value: q.value, high: q.high, family: q.family, base: q.base }));
    expect(found).toHaveLength(want.length);
    want.forEach((w, i) => expect(found[i]).toMatchObject(w));
  });
});
