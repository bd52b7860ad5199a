import { describe, expect, it } from 'vitest';
import { tokenize } from '../../src/text/tokenize.ts';

/**
 * What the tokenizer makes of text, token by token as `text/kind` (a clitic marked `text/clitic`).
 * The conventions are the project's own, after common practice in English tokenizers: a
 * contraction splits before its tail ("do" + "n't", as the Penn Treebank does), hyphenated
 * compounds and initialisms stay whole, and a blank line is one token of kind 'space'.
 */
const CASES: { text: string; want: string }[] = [
  { text: "I can't, won't; it's fine.", want: "I/word ca/word n't/clitic ,/punctuation wo/word n't/clitic ;/punctuation it/word 's/clitic fine/word ./punctuation" },
  { text: 'Don’t go; O’Brien’s tent', want: 'Do/word n’t/clitic go/word ;/punctuation O’Brien/word ’s/clitic tent/word' },
  { text: 'I cannot stay', want: 'I/word can/word not/word stay/word' },
  { text: 'well-known co-op R&D a_b', want: 'well-known/word co-op/word R&D/word a_b/word' },
  { text: '3.5 1,000 -4 +5 10:30 2024-05-01 1st 21st', want: '3.5/number 1,000/number -4/number +5/number 10:30/number 2024-05-01/number 1st/number 21st/number' },
  { text: '50% $5 €10 5kg 10km/h', want: '50/number %/symbol $/symbol 5/number €/symbol 10/number 5/number kg/word 10/number km/word //punctuation h/word' },
  { text: 'See https://example.org/a?b=1. Or www.example.com, then', want: 'See/word https://example.org/a?b=1/url ./punctuation Or/word www.example.com/url ,/punctuation then/word' },
  { text: 'Write to a.b@example.org! #camp @ranger', want: 'Write/word to/word a.b@example.org/email !/punctuation #camp/word @ranger/word' },
  { text: 'Dr. Reyes, the U.S. team, e.g. this; 5 p.m. today', want: 'Dr./word Reyes/word ,/punctuation the/word U.S./word team/word ,/punctuation e.g./word this/word ;/punctuation 5/number p.m./word today/word' },
  { text: 'Wait... really?!', want: 'Wait/word .../punctuation really/word ?/punctuation !/punctuation' },
  { text: 'a\r\n\r\nb\tc', want: 'a/word \r\n\r\n/space b/word \t/space c/word' },
  { text: 'ok 😀 👍🏽 👩‍👩‍👧 🇫🇷🇩🇪 :) <3', want: 'ok/word 😀/emoji 👍🏽/emoji 👩‍👩‍👧/emoji 🇫🇷/emoji 🇩🇪/emoji :)/emoji <3/emoji' },
  { text: 'café naïve Ångström', want: 'café/word naïve/word Ångström/word' },
  { text: '東京は大きい。 مرحبا بالعالم', want: '東京は大きい/other 。/punctuation مرحبا/other بالعالم/other' },
  { text: '"Quoted" (paren) [x]', want: '"/punctuation Quoted/word "/punctuation (/punctuation paren/word )/punctuation [/punctuation x/word ]/punctuation' },
];

const show = (text: string) =>
  tokenize(text)
    .map((t) => `${text.slice(t.start, t.end)}/${t.clitic ? 'clitic' : t.kind}`)
    .join(' ');

describe('tokenize', () => {
  it.each(CASES)('$text', ({ text, want }) => {
    expect(show(text)).toBe(want);
  });

  it('gives each token its text and lower case, and offsets that slice the text to it', () => {
    const text = 'Ünïcode AND 😀 x';
    for (const t of tokenize(text)) {
      expect(text.slice(t.start, t.end)).toBe(t.text);
      expect(t.lower).toBe(t.text.toLowerCase());
    }
  });

  it('reads a 1 MB run without spaces, and 100,000 short words, in time linear in length', () => {
    const long = 'a'.repeat(1_000_000);
    const t0 = performance.now();
    expect(tokenize(long)).toHaveLength(1);
    expect(tokenize('ab '.repeat(100_000))).toHaveLength(100_000);
    expect(tokenize('@'.repeat(300_000))).toHaveLength(300_000);
    expect(tokenize('ab.'.repeat(200_000))).toHaveLength(400_000);
    expect(tokenize('a.'.repeat(300_000))).toHaveLength(1); // one initialism, read once
    expect(performance.now() - t0).toBeLessThan(5000);
  });
});
