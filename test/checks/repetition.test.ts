import { deflateRawSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { compressedSize, repetition } from '../../src/checks/repetition.ts';
import { syntheticCorpus } from '../bench/corpus.ts';
import { checkTable } from './check-table.ts';

// Texts written for this project. Limits: seq-rep-4 (Welleck et al. 2019); most-frequent n-gram share
// 0.20/0.18/0.16 (Rae et al. 2021); compression ratio 2.4 (common practice).
const loop = (s: string, n: number) => Array(n).fill(s).join(' ');

checkTable(repetition, {
  flagged: [
    { text: 'Wash it gently. Wash it gently. Rinse it.', expect: [{ message: 'repeated-sentence', evidence: 'Wash it gently.' }] },
    { text: 'The Ember 2 takes screw-thread gas canisters. The Ember 2 takes screw-thread gas canisters.', expect: [{ message: 'repeated-sentence', evidence: 'The Ember 2 takes screw-thread gas canisters.' }] },
    { text: 'Boots should fit. Boots should fit. Boots should fit.', expect: [{ message: 'repeated-sentence', evidence: 'Boots should fit.' }] },
    { text: 'Mushrooms are fungi. Mushrooms are fungi. There are many kinds of fungi.', expect: [{ message: 'repeated-sentence', evidence: 'Mushrooms are fungi.' }] },
    { text: 'Altitude matters. Altitude matters.', expect: [{ message: 'repeated-sentence', evidence: 'Altitude matters.' }] },
    { text: 'Open Account settings and choose Email. Open Account settings and choose Email. Then enter the new address.', expect: [{ message: 'repeated-sentence', evidence: 'Open Account settings and choose Email.' }] },
    { text: 'Keep the stove outside the tent at all times. Always keep the stove outside the tent at all times.', expect: [{ message: 'repeated-sentence', evidence: 'Always keep the stove outside the tent at all times.' }] },
    { text: 'Layers keep you warm. Layers keep you warm. Layers keep you warm.', expect: [{ message: 'repeated-sentence', evidence: 'Layers keep you warm.' }] },
    { text: 'Weather fronts are boundaries between air masses. Weather fronts are boundaries between air masses.', expect: [{ message: 'repeated-sentence', evidence: 'Weather fronts are boundaries between air masses.' }] },
    { text: 'Drink water often. Eat salty snacks. Drink water often.', expect: [{ message: 'repeated-sentence', evidence: 'Drink water often.' }] },
    { text: loop('the comfort rating is', 6), expect: [{ message: 'repeated-phrase', evidence: 'the comfort rating is' }, { message: 'high-seq-rep', evidence: loop('the comfort rating is', 6) }] },
    { text: loop('pack the tent and', 8), expect: [{ message: 'high-seq-rep', evidence: loop('pack the tent and', 8) }] },
    { text: `Our best tent. ${loop('very very very good', 5)}`, expect: [{ message: 'repeated-phrase', evidence: 'very very very good' }] },
    { text: 'Read the map. Check the map. Fold the map. Read the map.', expect: [{ message: 'repeated-sentence', evidence: 'Read the map.' }] },
    { text: 'It is easy to pitch. It is easy to pitch.', expect: [{ message: 'repeated-sentence', evidence: 'It is easy to pitch.' }] },
    { text: 'Thunder follows lightning! Thunder follows lightning!', expect: [{ message: 'repeated-sentence', evidence: 'Thunder follows lightning!' }] },
    { text: 'Call us today.\nCall us today.\nCall us today.', expect: [{ message: 'repeated-sentence', evidence: 'Call us today.' }] },
    { text: `${loop('Stay on the trail and stay safe.', 12)}`, expect: [{ message: 'compressible', evidence: loop('Stay on the trail and stay safe.', 12) }] },
    { text: 'Clean the wound. Cover the wound. Clean the wound.', expect: [{ message: 'repeated-sentence', evidence: 'Clean the wound.' }] },
    { text: 'Clip the poles to the inner tent before you stake it. Clip the poles to the inner tent before you stake it out.', expect: [{ message: 'repeated-sentence', evidence: 'Clip the poles to the inner tent before you stake it out.' }] },
  ],
  clean: [
    'Pitch with the narrow end into the wind. Stake the upwind corners first, then insert the poles.',
    'Bring the water to a rolling boil for 1 minute. Above about 2,000 metres, boil it for 3 minutes.',
    'Stop as soon as you feel a hot spot. Clean the area and cover it with a plaster.',
    'Light is a fast runner and sound is a slow walker.',
    'Close the zips, wash on a gentle cycle with a technical cleaner, rinse twice, then tumble dry on low.',
    'Keep at least 25 metres away, more if it has a calf.',
    'The comfort rating is the lowest temperature at which an average sleeper stays comfortable.',
    'Rain drums soft on the tent at night,\nand morning comes up washed and bright.',
    'Water, snacks, a rain jacket, sun cream, a hat, a map, a phone and a first-aid kit.',
    'Drown it, stir it, and drown it again.',
    'Yes.',
    '',
    'Scrape the sting out sideways, wash the area and cool it.',
    'Use a bowline at the bag and two half hitches on the trunk.',
    'It shipped on Monday and should arrive within 3 to 5 working days.',
    'Turn the dial until its lines match the grid, then turn yourself until the needle sits in the arrow.',
    'Melt snow rather than eating it, and treat it if it may be dirty.',
    'A front is where warm air meets cold air; the weather often changes there.',
    'Go slowly above 3,000 metres and rest every third or fourth day.',
    'Check the code for spaces, then check that the card has not expired.',
  ],
});

// The compression ratio is defined on zlib's default deflate (level 6, 32 KB window, memory
// level 8): the smaller window used for short texts must give exactly the same output size.
describe('compressed size', () => {
  const cases = [
    'Stay on the trail. '.repeat(40),
    'Close the zips, wash on a gentle cycle with a technical cleaner, rinse twice, then tumble dry on low.',
    Array.from({ length: 300 }, (_, i) => `step ${i * 7919 % 1000} of the climb`).join(', '),
    'café 😀 水を沸騰させる。 '.repeat(30),
    'x'.repeat(40_000),
  ];
  it.each(cases.map((text) => ({ text, label: `${text.slice(0, 30)}… (${text.length} characters)` })))('$label', ({ text }) => {
    expect(compressedSize(text, Buffer.byteLength(text))).toBe(deflateRawSync(text).length);
  });
  it('for 300 generated responses of 0.3–9 KB', () => {
    const texts = [...syntheticCorpus(200, 1200), ...syntheticCorpus(100, 6000, 3)];
    const differing = texts.filter((t) => compressedSize(t, Buffer.byteLength(t)) !== deflateRawSync(t).length);
    expect(differing).toEqual([]);
  });
});
