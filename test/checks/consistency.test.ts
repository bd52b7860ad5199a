import { consistency } from '../../src/checks/consistency.ts';
import { checkTable } from './check-table.ts';

const boil = 'How long should I boil stream water?';
checkTable(consistency, {
  flagged: [
    { text: 'Boil the water for 10 minutes.', prompt: boil, siblings: ['Boil the water for 1 minute.', 'A rolling boil for 1 minute is enough.'], expect: [{ message: 'disagrees', evidence: '10 minutes' }] },
    { text: 'Keep at least 100 metres away from a moose.', prompt: 'How far from a moose?', siblings: ['Keep at least 25 metres away.'], expect: [{ message: 'disagrees', evidence: '100 metres' }] },
    { text: 'On high the lamp lasts 12 hours.', prompt: 'How long does the battery last?', siblings: ['On high the lamp lasts about 4 hours.'], expect: [{ message: 'disagrees', evidence: '12 hours' }] },
  ],
  clean: [
    { text: 'Boil the water for 1 minute.', prompt: boil, siblings: ['Boil the water for one minute.', 'A boil of 60 seconds is enough.'] },
    { text: 'Sleep no more than 300 to 500 metres higher each day.', prompt: 'How fast can I climb?', siblings: ['About 400 metres of sleeping height a day.'] },
    { text: 'Boil the water for 10 minutes.', prompt: boil },
    { text: 'Bring 2 litres of water.', prompt: 'Packing list?', siblings: ['The trail is 12 kilometres long.'] },
  ],
});
