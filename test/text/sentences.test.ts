import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/text/analyze.ts';

/**
 * Where sentences end. The rules are common practice in rule-based sentence splitters: a
 * terminator followed by white space and a word not in lower case ends one; titles ("Dr.") and
 * Latin abbreviations ("e.g.") do not; a blank line, a list item or a heading line does.
 */
const CASES: { text: string; want: string[] }[] = [
  { text: 'Boil it. Then cool it! Ready? Yes.', want: ['Boil it.', 'Then cool it!', 'Ready?', 'Yes.'] },
  { text: 'Wait... really?! Yes.', want: ['Wait... really?!', 'Yes.'] },
  { text: 'He said "Go." Then left.', want: ['He said "Go."', 'Then left.'] },
  { text: '(Take water.) Next step', want: ['(Take water.)', 'Next step'] },
  { text: 'Dr. Reyes came. Mr. Ito too.', want: ['Dr. Reyes came.', 'Mr. Ito too.'] },
  { text: 'Pack light, e.g. a tarp. It works.', want: ['Pack light, e.g. a tarp.', 'It works.'] },
  { text: 'Ship it to the U.S. It arrives soon.', want: ['Ship it to the U.S.', 'It arrives soon.'] },
  { text: 'It costs 3.50 today. See example.org now.', want: ['It costs 3.50 today.', 'See example.org now.'] },
  { text: 'First line\nsame sentence.', want: ['First line\nsame sentence.'] },
  { text: 'One\n\nTwo', want: ['One', 'Two'] },
  { text: 'One\r\n\r\nTwo', want: ['One', 'Two'] },
  { text: 'Steps:\n- boil\n- cool', want: ['Steps:', '- boil', '- cool'] },
  { text: 'Steps:\n1. Boil it\n2. Cool it', want: ['Steps:', '1. Boil it', '2. Cool it'] },
  { text: '## Water\nBoil it first.', want: ['## Water', 'Boil it first.'] },
  { text: '東京は大きい。 Yes.', want: ['東京は大きい。', 'Yes.'] },
  { text: '\n\n  Leading space. ', want: ['Leading space.'] },
  { text: '', want: [] },
];

describe('sentences', () => {
  it.each(CASES)('$text', ({ text, want }) => {
    const doc = analyze(text);
    expect(doc.sentences.map((s) => text.slice(s.start, s.end))).toEqual(want);
    // every token belongs to a sentence in range, and sentences cover the tokens in order
    for (const t of doc.tokens) expect(t.sentence).toBeLessThan(Math.max(1, want.length));
    doc.sentences.forEach((s, i) => expect(s.index).toBe(i));
  });
});
