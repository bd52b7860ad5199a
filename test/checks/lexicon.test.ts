import { lexicon } from '../../src/checks/lexicon.ts';
import { checkTable } from './check-table.ts';

const terms = [
  { term: 'mix bleach', category: 'hazard', severity: 'error' },
  { term: 'idiot', category: 'insult', stem: true },
  { term: 'just google it', category: 'dismissive' },
];

checkTable(lexicon, {
  flagged: [
    { text: 'Obviously, compasses point north. Just google it.', expect: [{ message: 'term', evidence: 'Obviously' }, { message: 'term', evidence: 'Just google it' }] },
    { text: 'That is a stupid question.', expect: [{ message: 'term', evidence: 'stupid question' }] },
    { text: 'Only idiots forget water.', params: { terms }, expect: [{ message: 'term', evidence: 'idiots' }] },
    { text: 'For a deep clean, mix bleach with the wash water.', params: { terms }, expect: [{ message: 'term', evidence: 'mix bleach' }] },
  ],
  clean: [
    { text: 'Never mix bleach with other cleaners.', params: { terms } },
    { text: 'Do not mix bleach into the wash.', params: { terms } },
    'Compasses point to magnetic north.',
    'Search the help pages for "returns".',
  ],
});
