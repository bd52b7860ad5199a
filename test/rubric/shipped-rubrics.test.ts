import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadRubric } from '../../src/rubric/load.ts';
import { runExamples } from '../../src/rubric/run-examples.ts';
import { rubricJsonSchemaText } from '../../src/rubric/json-schema.ts';
import { CHECKS } from '../../src/checks/registry.ts';

const dir = new URL('../../rubrics/', import.meta.url);
const files = readdirSync(dir).filter((f) => f.endsWith('.yaml'));

describe('shipped rubrics', () => {
  it('include a general default, the demo scenario and one for young readers', () => {
    expect(files.sort()).toEqual(['cairnfield-support.yaml', 'general.yaml', 'young-readers.yaml']);
  });
  for (const file of files) {
    describe(file, () => {
      const text = readFileSync(new URL(file, dir), 'utf8');
      const { rubric, problems } = loadRubric(text);
      it('passes rubric check', () => expect(problems).toEqual([]));
      it('references the JSON Schema for editors', () => {
        expect(text).toContain('$schema: ./plumbline-rubric.schema.json');
        expect(text).toContain('# yaml-language-server: $schema=./plumbline-rubric.schema.json');
      });
      it('has examples, and they all pass rubric test', () => {
        expect(rubric!.examples.length).toBeGreaterThanOrEqual(3);
        for (const result of runExamples(rubric!)) expect(result.failures, result.example.name).toEqual([]);
      });
    });
  }
});

describe('the JSON Schema', () => {
  it('in rubrics/ is the one generated from the rubric spec (run npm run build:schema after changing it)', () => {
    expect(readFileSync(new URL('plumbline-rubric.schema.json', dir), 'utf8')).toBe(rubricJsonSchemaText());
  });
  it('describes every check and its parameters', () => {
    const schema = JSON.parse(rubricJsonSchemaText());
    const criterion = schema.properties.criteria.items;
    expect(criterion.properties.check.enum).toEqual(CHECKS.map((c) => c.meta.id));
    expect(criterion.allOf).toHaveLength(CHECKS.length);
    const repetition = criterion.allOf.find((x: any) => x.if.properties.check.const === 'repetition');
    expect(Object.keys(repetition.then.properties.params.properties)).toContain('max_seq_rep');
  });
});
