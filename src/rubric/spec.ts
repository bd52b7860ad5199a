import { CHECKS } from '../checks/registry.ts';
import type { ParamSpec } from '../checks/define-check.ts';

/**
 * The one description of the rubric format. The validator (`validate.ts`) walks a YAML file
 * against it and the JSON Schema (`json-schema.ts`) is generated from it, so the two never
 * disagree. Keys in files are snake_case; check parameters are the checks' own names in
 * snake_case (`minWords` → `min_words`).
 */
export type Spec =
  | { kind: 'string'; description: string; pattern?: RegExp; patternText?: string; minLength?: number }
  | { kind: 'number' | 'integer'; description: string; min?: number; max?: number; nullable?: boolean }
  | { kind: 'boolean'; description: string }
  | { kind: 'enum'; description: string; values: readonly string[] }
  | { kind: 'regex'; description: string }
  | { kind: 'array'; description: string; of: Spec; minItems?: number; unique?: 'value' | string; itemName?: string }
  | { kind: 'object'; description: string; fields: Record<string, Field>; oneOf?: string[][] }
  | { kind: 'map'; description: string; of: Spec; keyPattern?: RegExp; keyPatternText?: string }
  | { kind: 'params'; description: string };

export type Field = Spec & { required?: boolean; default?: unknown };

export const SEVERITIES = ['info', 'warn', 'error', 'critical'] as const;
export type Severity = (typeof SEVERITIES)[number];
export const BAND_NAMES = ['pass', 'review', 'fail'] as const;
export type Band = (typeof BAND_NAMES)[number];

const ID = /^[a-z0-9][a-z0-9-]*$/;
const ID_TEXT = '^[a-z0-9][a-z0-9-]*$';

const idField = (description: string): Field => ({ kind: 'string', description, pattern: ID, patternText: ID_TEXT, required: true });

const bands = (scale: string, pass: number, review: number, max: number): Field => ({
  kind: 'object',
  description: `Band edges on ${scale}: at or above "pass" is pass, at or above "review" is review, below is fail.`,
  fields: {
    pass: { kind: 'number', description: 'Lowest value that passes.', min: 0, max, default: pass },
    review: { kind: 'number', description: 'Lowest value sent to review rather than failed; at most "pass".', min: 0, max, default: review },
  },
});

const phraseList = (description: string): Extract<Spec, { kind: 'array' }> => ({ kind: 'array', description, of: { kind: 'string', description: 'A phrase; whole words; a trailing * matches any ending.', minLength: 1 }, unique: 'value', itemName: 'phrase' });

export const TERM_SPEC: Spec = {
  kind: 'object',
  description: 'A term: a phrase ("term") or a regular expression ("pattern"), with a category.',
  oneOf: [['term'], ['pattern']],
  fields: {
    term: { kind: 'string', description: 'Words to find, on word boundaries.', minLength: 1 },
    pattern: { kind: 'regex', description: 'A regular expression (JavaScript syntax, case-insensitive); nested or alternated repetition and back-references are refused.' },
    category: { kind: 'string', description: 'What kind of term this is (shown to reviewers).', minLength: 1, required: true },
    severity: { kind: 'enum', description: 'How serious a match is.', values: SEVERITIES },
    stem: { kind: 'boolean', description: 'Match any inflection (compares Porter stems).' },
    even_negated: { kind: 'boolean', description: 'Match inside a negation\'s scope too ("never …").' },
  },
};

const TOPIC_SPEC: Spec = {
  kind: 'object',
  description: 'A risk topic: prompt wording that raises it and answer wording that counts as a caveat.',
  fields: {
    id: idField('Topic id.'),
    prompt_terms: { ...phraseList('Prompt wording that raises the topic.'), required: true, minItems: 1 },
    prompt_context: phraseList('When given, the prompt must also contain one of these.'),
    caveat_terms: { ...phraseList('Answer wording that counts as a caveat.'), required: true, minItems: 1 },
  },
};

/** The spec of one check parameter, from the check's own declaration. */
export function paramSpec(spec: ParamSpec): Spec {
  switch (spec.type) {
    case 'number':
    case 'integer':
      return { kind: spec.type, description: spec.description, min: spec.min, max: spec.max, nullable: spec.nullable };
    case 'boolean':
      return { kind: 'boolean', description: spec.description };
    case 'string':
      return { kind: 'string', description: spec.description };
    case 'string[]':
      return phraseList(spec.description);
    case 'terms':
      return { kind: 'array', description: spec.description, of: TERM_SPEC, unique: 'term', itemName: 'term' };
    case 'topics':
      return { kind: 'array', description: spec.description, of: TOPIC_SPEC, unique: 'id', itemName: 'topic' };
  }
}

/** snake_case for a camelCase parameter name. */
export function snake(name: string): string {
  return name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

/** camelCase for a snake_case key. */
export function camel(name: string): string {
  return name.replace(/_([a-z])/g, (_, c: string) => c.toUpperCase());
}

/** The parameters each check accepts in a rubric, as specs keyed by their snake_case names. */
export function checkParamSpecs(): Record<string, Record<string, Spec>> {
  return Object.fromEntries(CHECKS.map((c) => [c.meta.id, Object.fromEntries(Object.entries(c.meta.params).map(([k, p]) => [snake(k), paramSpec(p)]))]));
}

export const CRITERION_SPEC: Spec = {
  kind: 'object',
  description: 'One criterion: a check, its parameters, weight, severity and band edges.',
  fields: {
    id: idField('Criterion id, unique in the rubric.'),
    check: { kind: 'enum', description: 'The check it runs.', values: CHECKS.map((c) => c.meta.id), required: true },
    description: { kind: 'string', description: 'What the criterion asks of a response.' },
    weight: { kind: 'number', description: 'Weight in the overall score (0 leaves it out of the sum).', min: 0, default: 1 },
    severity: { kind: 'enum', description: 'How serious failing it is; a failed critical criterion fails the response.', values: SEVERITIES, default: 'warn' },
    bands: bands('the criterion value (0–1)', 0.8, 0.5, 1),
    term_lists: { kind: 'array', description: 'Names of term lists (from term_lists) added to a lexicon criterion\'s terms.', of: { kind: 'string', description: 'A term list name.' }, unique: 'value', itemName: 'term list' },
    params: { kind: 'params', description: 'Parameters of the check; see each check in the README.' },
  },
};

export const RUBRIC_SPEC: Spec = {
  kind: 'object',
  description: 'A Plumbline rubric: criteria that score each response, and how work is triaged and agreed.',
  fields: {
    $schema: { kind: 'string', description: 'Path of the JSON Schema, for editors.' },
    id: idField('Rubric id; versions of the same rubric share it.'),
    title: { kind: 'string', description: 'Name shown to people.', minLength: 1, required: true },
    description: { kind: 'string', description: 'What the rubric is for.' },
    overall_bands: bands('the overall score (0–100)', 75, 50, 100),
    criteria: { kind: 'array', description: 'The criteria.', of: CRITERION_SPEC, minItems: 1, unique: 'id', itemName: 'criterion', required: true },
    term_lists: { kind: 'map', description: 'Named term lists for lexicon criteria.', of: { kind: 'array', description: 'Terms.', of: TERM_SPEC, minItems: 1, unique: 'term', itemName: 'term' }, keyPattern: ID, keyPatternText: ID_TEXT },
    triage: {
      kind: 'object',
      description: 'How item priority is computed: critical findings first, then the most uncertain, then flag severity, then age.',
      fields: {
        edge_margin: { kind: 'number', description: 'A score this close (0–100 points) to a band edge counts as uncertain.', min: 0, max: 50, default: 5 },
        close_margin: { kind: 'number', description: 'Candidates this close (points) to each other count as uncertain.', min: 0, max: 50, default: 3 },
      },
    },
    agreement: {
      kind: 'object',
      description: 'Defaults for batches scored with this rubric.',
      fields: {
        reviews: { kind: 'integer', description: 'Independent reviews per item.', min: 1, max: 5, default: 1 },
        rule: { kind: 'enum', description: 'top: same first choice; pairwise: share of pairs ordered alike at or above threshold.', values: ['top', 'pairwise'], default: 'top' },
        threshold: { kind: 'number', description: 'Pairwise agreement needed with rule "pairwise".', min: 0, max: 1, default: 0.75 },
        blind_first: { kind: 'boolean', description: 'Hide scores until a reviewer commits a first ranking.', default: true },
      },
    },
    audience: {
      kind: 'object',
      description: 'Who the answers are for; readability criteria use it when their own target is not set.',
      fields: {
        grade: { kind: 'number', description: 'US reading grade of the audience; null reads it from each prompt.', min: 0, max: 18, nullable: true, default: null },
        tolerance: { kind: 'number', description: 'Grades above the target still accepted.', min: 0, max: 10, default: 2 },
      },
    },
    examples: {
      kind: 'array',
      description: 'Examples that `plumbline rubric test` runs like unit tests.',
      unique: 'name',
      itemName: 'example',
      of: {
        kind: 'object',
        description: 'A prompt and response with the band each named criterion must give.',
        fields: {
          name: { kind: 'string', description: 'Example name.', minLength: 1, required: true },
          prompt: { kind: 'string', description: 'The prompt.', required: true },
          response: { kind: 'string', description: 'The response scored.', required: true },
          others: { kind: 'array', description: 'Other candidates to the same prompt (for cross-candidate checks).', of: { kind: 'string', description: 'A candidate.' } },
          expect: { kind: 'map', description: 'Criterion id → expected band.', of: { kind: 'enum', description: 'Band.', values: BAND_NAMES }, required: true },
          expect_overall: { kind: 'enum', description: 'Expected overall band.', values: BAND_NAMES },
        },
      },
    },
  },
};
