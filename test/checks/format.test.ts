import { format } from '../../src/checks/format.ts';
import { checkTable } from './check-table.ts';

checkTable(format, {
  flagged: [
    { text: 'Water, snacks, a rain jacket, and', expect: [{ message: 'truncated', evidence: 'and' }] },
    { text: 'Stake the upwind corners first. Then add the poles, and then', expect: [{ message: 'truncated', evidence: 'then' }] },
    { text: 'Here:\n```python\ndef minutes(grams):\n    return grams / 3.5\n', expect: [{ message: 'unclosed-fence', evidence: '```' }] },
    { text: '- Water\n- Sun cream (\n- Tide times', expect: [{ message: 'unclosed-bracket', evidence: '(' }] },
    { text: 'He said "take the left fork at the cairn.', expect: [{ message: 'unbalanced-quotes', evidence: '"' }] },
    { text: 'Pack light.]', expect: [{ message: 'unmatched-closer', evidence: ']' }] },
    { text: 'abcdefghij', params: { maxChars: 5 }, expect: [{ message: 'too-long', evidence: 'fghij' }] },
  ],
  clean: [
    'Water, snacks, a rain jacket and sun cream.',
    '- Water\n- Snacks\n- Tide times',
    'Here is one:\n```js\nconst m = (g) => g / 3.5;\n```\nThat is a rough figure.',
    'Rain drums soft on the tent at night,\nand morning comes up washed and bright.',
    'Use a bowline (a fixed loop) at the bag.',
    'Great trip :)',
    '1) Pack 2) Go',
    'He said "take the left fork".',
  ],
});
