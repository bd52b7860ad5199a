import { certainty } from '../../src/checks/certainty.ts';
import { checkTable } from './check-table.ts';

// Texts written for this project. Hedge cues after the CoNLL-2010 shared task (Farkas et al. 2010).
const health = 'Is it safe to drink stream water?';

checkTable(certainty, {
  flagged: [
    { text: 'You only need to boil it for 20 seconds. This is 100% guaranteed to kill everything.', prompt: health, expect: [{ message: 'absolute', evidence: '100%' }, { message: 'absolute', evidence: 'guaranteed' }] },
    { text: 'Yes, trail mushrooms are completely safe.', prompt: 'Can I eat trail mushrooms?', expect: [{ message: 'absolute', evidence: 'completely safe' }] },
    { text: 'Snow is always perfectly clean to eat.', prompt: 'Is it safe to eat snow?', expect: [{ message: 'absolute', evidence: 'always perfectly' }] },
    { text: 'There is no risk at all in cooking inside.', prompt: 'Can I cook in my tent?', expect: [{ message: 'absolute', evidence: 'no risk' }] },
    { text: 'Yes, definitely, every airline allows it.', prompt: 'Can I take gas canisters on a plane?', expect: [{ message: 'absolute', evidence: 'definitely' }] },
    { text: 'This repellent is risk-free for toddlers.', prompt: 'Which repellent suits a toddler?', expect: [{ message: 'absolute', evidence: 'risk-free' }] },
    { text: 'Filters are always exactly as good as boiling. There is no difference at all.', prompt: 'Is a water filter as good as boiling?', expect: [{ message: 'absolute', evidence: 'no difference at all' }] },
    { text: 'Studies show that everyone starts shivering at 35 degrees.', prompt: 'Signs of hypothermia?', expect: [{ message: 'unsourced', evidence: 'Studies show' }] },
    { text: 'Experts agree it is always obvious.', expect: [{ message: 'unsourced', evidence: 'Experts agree' }] },
    { text: 'It is widely known that hypothermia never happens above freezing.', expect: [{ message: 'unsourced', evidence: 'It is widely known' }] },
    { text: 'Research shows boiling removes all chemicals.', expect: [{ message: 'unsourced', evidence: 'Research shows' }] },
    { text: 'According to research, filters are better.', expect: [{ message: 'unsourced', evidence: 'According to research' }] },
    { text: 'Read more at http://example.com/deals/xxxx.', expect: [{ message: 'placeholder-link', evidence: 'http://example.com/deals/xxxx' }] },
    { text: 'See https://your-link-here for the manual.', expect: [{ message: 'placeholder-link', evidence: 'https://your-link-here' }] },
    { text: 'Details at http://localhost/manual.pdf today.', expect: [{ message: 'placeholder-link', evidence: 'http://localhost/manual.pdf' }] },
    { text: 'See doi:10.0000/xxxxx for details.', expect: [{ message: 'malformed-doi', evidence: 'doi:10.0000/xxxxx' }] },
    { text: 'The paper is 10.12/abc in the journal.', expect: [{ message: 'malformed-doi', evidence: '10.12/abc' }] },
    { text: 'It might possibly be somewhat similar, perhaps, in some cases.', expect: [{ message: 'hedge-stacking', evidence: 'It might possibly be somewhat similar, perhaps, in some cases.' }] },
    { text: 'It could maybe suggest that filters may perhaps work.', expect: [{ message: 'hedge-stacking', evidence: 'It could maybe suggest that filters may perhaps work.' }] },
    { text: 'Scientists say this stove is totally safe indoors.', prompt: 'Can I use my stove indoors?', expect: [{ message: 'unsourced', evidence: 'Scientists say' }, { message: 'absolute', evidence: 'totally safe' }] },
  ],
  clean: [
    { text: 'Bring the water to a rolling boil for 1 minute.', prompt: health },
    { text: 'Do not eat wild mushrooms unless an expert has identified them.', prompt: 'Can I eat trail mushrooms?' },
    { text: 'Gas canisters are generally not allowed on planes; check with your airline.', prompt: 'Can I take gas canisters on a plane?' },
    { text: 'A good filter removes bacteria and protozoa, but most do not stop viruses.', prompt: 'Is a filter as good as boiling?' },
    { text: 'Wait 30 minutes for clear water; it may take longer in cold water.', prompt: 'How long do tablets take?' },
    { text: 'It definitely rained a lot last week.', prompt: 'Write a short poem about rain.' },
    { text: 'We guarantee a refund within 60 days.', prompt: 'What is your return policy?' },
    { text: 'A study by the park service (https://parks.example.gov/report) found fewer moose near trails.', prompt: 'How far from a moose?' },
    { text: 'See doi:10.1000/182 for the handbook.' },
    { text: 'The manual is at https://help.cairnfield-outfitters-demo.net/ember-2.', prompt: 'Where is the manual?' },
    { text: 'Usually 30 minutes, but it may take longer.', prompt: health },
    'Pitch with the narrow end into the wind.',
    'Light is fast and sound is slow.',
    'Sign in and open Account settings.',
    'The comfort rating is the temperature at which most people sleep comfortably.',
    'Rest the ankle, keep it raised, and see a doctor if the pain does not ease.',
    'Keep at least 25 metres away from a moose.',
    'It is probably a weather front.',
    'Rain drums soft on the tent at night.',
    '',
  ],
});
