import { describe, expect, it } from 'vitest';
import { nonAnswer, tfidfCosine } from '../../src/checks/non-answer.ts';
import { checkTable } from './check-table.ts';

/**
 * TF-IDF with smoothed IDF, idf(t) = ln((1 + n) / (1 + df(t))) + 1, raw term counts and cosine
 * of the two vectors: the definition in scikit-learn's TfidfTransformer documentation
 * (smooth_idf=True; recalled from memory). Values worked by hand from that formula.
 */
describe('TF-IDF cosine', () => {
  const CASES: { a: string[]; b: string[]; corpus: string[][]; want: number }[] = [
    // idf(a) = 1, idf(b) = idf(c) = ln(3/2) + 1 = 1.405465; cos = 1 / (1 + 1.405465²) = 0.336097
    { a: ['a', 'b'], b: ['a', 'c'], corpus: [['a', 'b'], ['a', 'c']], want: 0.336097 },
    { a: ['a', 'b'], b: ['a', 'b'], corpus: [['a', 'b'], ['a', 'b']], want: 1 },
    { a: ['a'], b: ['c'], corpus: [['a'], ['c']], want: 0 },
    // tf 2 for "a": va = (2, 1.405465), vb = (1, 0); cos = 2 / sqrt(4 + 1.975332) = 0.818180
    { a: ['a', 'a', 'b'], b: ['a'], corpus: [['a', 'a', 'b'], ['a']], want: 0.818180 },
    { a: [], b: ['a'], corpus: [[], ['a']], want: 0 },
  ];
  it.each(CASES)('$a · $b', ({ a, b, corpus, want }) => {
    expect(tfidfCosine(a, b, corpus)).toBeCloseTo(want, 5);
  });
});

checkTable(nonAnswer, {
  flagged: [
    { text: '   ', prompt: 'Where is my order?', expect: [{ message: 'empty', evidence: '   ' }] },
    { text: 'Yes.', prompt: 'Where is my order?', expect: [{ message: 'too-short', evidence: 'Yes.' }] },
    { text: 'What fuel does the Ember 1 stove take? What fuel does the Ember 3 stove take?', prompt: 'What fuel does the Ember 2 stove take?', expect: [{ message: 'continues-prompt', evidence: 'What fuel does the Ember 1 stove take?' }, { message: 'continues-prompt', evidence: 'What fuel does the Ember 3 stove take?' }] },
    { text: 'Write a two-line poem about snow for our store newsletter. Write a two-line poem about wind for our store newsletter.', prompt: 'Write a two-line poem about rain for our store newsletter.', expect: [{ message: 'continues-prompt', evidence: 'Write a two-line poem about snow for our store newsletter.' }] },
    { text: 'Our return policy allows 60 days for unused items.', prompt: 'Write a two-line poem about rain.', siblings: ['Rain drums soft on the tent at night.'], expect: [{ message: 'off-topic', evidence: 'Our return policy allows 60 days for unused items.' }] },
  ],
  clean: [
    { text: 'The Ember 2 takes screw-thread gas canisters.', prompt: 'What fuel does the Ember 2 stove take?' },
    { text: 'Rest the ankle and wrap it firmly.', prompt: 'My friend twisted her ankle. What should we do?', siblings: ['Keep the ankle raised and rest.'] },
    { text: 'Rain drums soft on the tent at night,\nand morning comes up washed and bright.', prompt: 'Write a two-line poem about rain.', siblings: ['Grey clouds gather and the rain falls.'] },
    { text: 'Uphill hikers have the right of way. Do you hike often?', prompt: 'Who has right of way on a narrow trail?' },
  ],
});
