import { describe, expect, it } from 'vitest';
import { loadRubric } from '../../src/rubric/load.ts';
import { regexProblem } from '../../src/rubric/regex-safety.ts';
import { closest } from '../../src/rubric/suggest.ts';

const valid = `id: t
title: T
criteria:
  - id: reps
    check: repetition
`;

/** Each case: a rubric with one mistake, and the exact place and wording of the problem. */
const cases: { kind: string; text: string; line: number; column: number; message: RegExp }[] = [
  { kind: 'YAML syntax error', text: 'id: t\ntitle: T\ncriteria: [\n  { id: a, check: format\n', line: 5, column: 1, message: /^YAML: / },
  { kind: 'unknown top-level key', text: `${valid}criterias: []\n`, line: 6, column: 1, message: /^unknown key "criterias" in rubric — did you mean "criteria"\?$/ },
  { kind: 'unknown criterion key', text: `${valid}    wieght: 2\n`, line: 6, column: 5, message: /^unknown key "wieght" in criteria\[1\] — did you mean "weight"\?$/ },
  { kind: 'unknown check id', text: 'id: t\ntitle: T\ncriteria:\n  - id: a\n    check: repitition\n', line: 5, column: 12, message: /^unknown check "repitition" for criteria\[1\]\.check — did you mean "repetition"\?$/ },
  { kind: 'unknown parameter', text: `${valid}    params:\n      maxSeqRepp: 0.2\n`, line: 7, column: 7, message: /^check "repetition" has no parameter "maxSeqRepp" — did you mean "max_seq_rep"\?$/ },
  { kind: 'parameter of the wrong type', text: `${valid}    params:\n      n: four\n`, line: 7, column: 10, message: /^criteria\[1\]\.params\.n must be a whole number, not "four"$/ },
  { kind: 'parameter out of range', text: `${valid}    params:\n      max_seq_rep: 1.5\n`, line: 7, column: 20, message: /^criteria\[1\]\.params\.max_seq_rep is 1\.5, above the maximum 1$/ },
  { kind: 'duplicate criterion id', text: `${valid}  - id: reps\n    check: format\n`, line: 6, column: 9, message: /^duplicate criterion id "reps" in criteria \(first at line 4\)$/ },
  { kind: 'negative weight', text: `${valid}    weight: -1\n`, line: 6, column: 13, message: /^criteria\[1\]\.weight is -1, below the minimum 0$/ },
  { kind: 'all weights zero', text: 'id: t\ntitle: T\ncriteria:\n  - id: a\n    check: format\n    weight: 0\n', line: 4, column: 3, message: /^every criterion has weight 0/ },
  { kind: 'band edges out of order', text: `${valid}    bands: { pass: 0.4, review: 0.6 }\n`, line: 6, column: 12, message: /^criteria\[1\]\.bands out of order: review \(0\.6\) is above pass \(0\.4\)/ },
  { kind: 'overall band edges out of order', text: `${valid}overall_bands: { pass: 50, review: 70 }\n`, line: 6, column: 16, message: /^overall_bands out of order/ },
  { kind: 'invalid regular expression', text: `${valid}  - id: words\n    check: lexicon\n    params:\n      terms:\n        - { pattern: "a(b", category: x }\n`, line: 10, column: 22, message: /pattern is not a valid regular expression/ },
  { kind: 'catastrophic regular expression', text: `${valid}  - id: words\n    check: lexicon\n    params:\n      terms:\n        - { pattern: "(\\\\w+\\\\s?)+$", category: x }\n`, line: 10, column: 22, message: /can backtrack catastrophically/ },
  { kind: 'empty term', text: `${valid}  - id: words\n    check: lexicon\n    params:\n      terms:\n        - { term: "  ", category: x }\n`, line: 10, column: 19, message: /term is empty/ },
  { kind: 'duplicate term', text: `${valid}  - id: words\n    check: lexicon\n    params:\n      terms:\n        - { term: idiot, category: x }\n        - { term: Idiot, category: x }\n`, line: 11, column: 19, message: /^duplicate term "Idiot" in criteria\[2\]\.params\.terms \(first at line 10\)$/ },
  { kind: 'empty phrase in a list', text: 'id: t\ntitle: T\ncriteria:\n  - id: r\n    check: refusal\n    params:\n      phrases: ["i cannot help", ""]\n', line: 7, column: 34, message: /phrases\[2\] is empty/ },
  { kind: 'example naming an unknown criterion', text: `${valid}examples:\n  - name: e\n    prompt: p\n    response: r\n    expect: { rep: pass }\n`, line: 10, column: 15, message: /^example "e" expects a band for unknown criterion "rep" — did you mean "reps"\?$/ },
  { kind: 'unknown band in an example', text: `${valid}examples:\n  - name: e\n    prompt: p\n    response: r\n    expect: { reps: passed }\n`, line: 10, column: 21, message: /^unknown value "passed" for examples\[1\]\.expect\.reps — did you mean "pass"\?$/ },
  { kind: 'unknown term list', text: `${valid}  - id: words\n    check: lexicon\n    term_lists: [rude]\nterm_lists:\n  rudeness:\n    - { term: idiot, category: insult }\n`, line: 8, column: 18, message: /^unknown term list "rude"/ },
  { kind: 'missing required key', text: 'id: t\ncriteria:\n  - id: a\n    check: format\n', line: 1, column: 1, message: /^rubric is missing "title"/ },
  { kind: 'wrong kind of value', text: 'id: t\ntitle: T\ncriteria: format\n', line: 3, column: 11, message: /^criteria must be a list, not "format"$/ },
];

describe('rubric check: each kind of problem at its exact line and column', () => {
  it('a valid rubric has no problems', () => {
    const result = loadRubric(valid);
    expect(result.problems).toEqual([]);
    expect(result.rubric?.criteria.map((c) => c.id)).toEqual(['reps']);
  });
  for (const c of cases) {
    it(c.kind, () => {
      const { problems, rubric } = loadRubric(c.text);
      expect(rubric).toBeUndefined();
      const hit = problems.find((p) => c.message.test(p.message));
      expect(hit, JSON.stringify(problems)).toBeDefined();
      expect([hit!.line, hit!.column], hit!.message).toEqual([c.line, c.column]);
    });
  }

  it('reports every problem of a file with many, in file order', () => {
    const text = [
      'id: Bad Id',
      'title: T',
      'criterias: []',
      'criteria:',
      '  - id: a',
      '    check: repitition',
      '  - id: a',
      '    check: format',
      '    weight: -3',
      '    bands: { pass: 0.2, review: 0.9 }',
      '  - id: c',
      '    check: lexicon',
      '    params:',
      '      terms:',
      '        - { term: "", category: x }',
      '        - { pattern: "(a|aa)*", category: y }',
      'examples:',
      '  - name: e',
      '    prompt: p',
      '    response: r',
      '    expect: { zz: pass }',
    ].join('\n');
    const { problems } = loadRubric(text);
    expect(problems.map((p) => `${p.line}:${p.column}`)).toEqual(['1:5', '3:1', '6:12', '7:9', '9:13', '10:12', '15:19', '16:22', '21:15']);
    expect(problems.map((p) => p.line)).toEqual([...problems.map((p) => p.line)].sort((a, b) => a - b));
  });
});

describe('regular expressions in rubrics are refused when they can backtrack catastrophically', () => {
  const refused: [string, RegExp][] = [
    ['(a+)+', /repeats a group that itself repeats/],
    ['([a-z]+)*x', /repeats a group that itself repeats/],
    ['(\\w+\\s?)+$', /repeats a group that itself repeats/],
    ['(a|ab)*c', /repeats a group of alternatives/],
    ['(x+x+)+y', /repeats a group that itself repeats/],
    ['(a)\\1', /back-reference/],
    ['(?<=x)y', /look-behind/],
    ['a(b', /not a valid regular expression/],
  ];
  for (const [pattern, why] of refused) it(`refuses ${pattern}`, () => expect(regexProblem(pattern)).toMatch(why));
  for (const pattern of ['\\bcolou?r\\b', '(ab)+', '[a-z]+@[a-z]+\\.com', '\\d{3}-\\d{4}', '(?:foo|bar) baz', 'x{2,5}', '(a|b)']) {
    it(`accepts ${pattern}`, () => expect(regexProblem(pattern)).toBeNull());
  }
});

describe('did you mean', () => {
  const table: [string, string[], string | undefined][] = [
    ['repitition', ['repetition', 'refusal'], 'repetition'],
    ['critera', ['criteria', 'title'], 'criteria'],
    ['zzzz', ['criteria', 'title'], undefined],
  ];
  for (const [name, known, expected] of table) it(`${name} → ${expected}`, () => expect(closest(name, known)).toBe(expected));
});
