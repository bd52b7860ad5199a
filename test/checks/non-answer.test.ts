import { nonAnswer } from '../../src/checks/non-answer.ts';
import { checkTable } from './check-table.ts';

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
