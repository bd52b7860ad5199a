import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Node } from 'yaml';
import type { LexiconTerm } from '../checks/lexicon.ts';
import { findCheck } from '../checks/registry.ts';
import { UserError, errorCode } from '../errors.ts';
import { camel, type Band, type Severity } from './spec.ts';
import { closest } from './suggest.ts';
import { parseRubricText, type Problem } from './validate.ts';

export interface BandEdges {
  pass: number;
  review: number;
}

export interface Criterion {
  id: string;
  check: string;
  description: string | null;
  weight: number;
  severity: Severity;
  bands: BandEdges;
  /** The check's parameters (camelCase), term lists merged in. */
  params: Record<string, unknown>;
}

export interface RubricExample {
  name: string;
  prompt: string;
  response: string;
  others: string[];
  expect: Record<string, Band>;
  expectOverall: Band | null;
}

export interface Rubric {
  id: string;
  title: string;
  description: string | null;
  /** Content hash of the canonical rubric: equal content, equal version. */
  version: string;
  overallBands: BandEdges;
  criteria: Criterion[];
  triage: { edgeMargin: number; closeMargin: number };
  agreement: { reviews: number; rule: 'top' | 'pairwise'; threshold: number; blindFirst: boolean };
  audience: { grade: number | null; tolerance: number };
  examples: RubricExample[];
  /** The file's text as written. */
  source: string;
}

export interface LoadResult {
  rubric?: Rubric;
  problems: Problem[];
}

type Raw = Record<string, any>;
const nodesOf = (raw: Raw | undefined): Record<string, Node> => (raw as { __nodes?: Record<string, Node> } | undefined)?.__nodes ?? {};
const keysOf = (raw: Raw | undefined): Record<string, Node> => (raw as { __keys?: Record<string, Node> } | undefined)?.__keys ?? {};

/** snake_case keys to camelCase, deeply (term and topic objects included). */
function camelKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(camelKeys);
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [camel(k), camelKeys(v)]));
  return value;
}

/** Sorted-key JSON: the canonical form a version hashes. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value)
      .filter((k) => k !== '$schema')
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Raw)[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/**
 * Validates a rubric's text and builds the rubric. Every problem is reported, in file order, with
 * its line and column; the rubric is returned only when there are none.
 *
 * @example
 * const { rubric, problems } = loadRubric(readFileSync('rubrics/general.yaml', 'utf8'));
 */
export function loadRubric(text: string): LoadResult {
  const parsed = parseRubricText(text);
  const { problems, walker } = parsed;
  const raw = parsed.raw as Raw | undefined;
  if (!raw) return { problems: sortProblems(problems) };
  const nodes = nodesOf(raw);
  const termLists: Record<string, LexiconTerm[]> = {};
  for (const [name, terms] of Object.entries((raw.term_lists ?? {}) as Raw)) termLists[name] = (camelKeys(terms) as LexiconTerm[]) ?? [];

  checkBands(walker, raw.overall_bands, nodes.overall_bands, 'overall_bands');
  const criteria: Criterion[] = [];
  const rawCriteria = (Array.isArray(raw.criteria) ? raw.criteria : []) as (Raw | undefined)[];
  rawCriteria.forEach((c, i) => {
    if (!c) return;
    const where = `criteria[${i + 1}]`;
    const cNodes = nodesOf(c);
    const check = typeof c.check === 'string' && findCheck(c.check) ? c.check : null;
    const params = check ? (camelKeys(walker.params(cNodes.params ?? null, check, `${where}.params`)) as Raw) : {};
    checkBands(walker, c.bands, cNodes.bands, `${where}.bands`);
    const lists = (c.term_lists ?? []) as string[];
    if (lists.length && check && check !== 'lexicon') walker.at(cNodes.term_lists, `${where}.term_lists only applies to lexicon criteria, not "${check}"`);
    const merged: LexiconTerm[] = [];
    lists.forEach((name, k) => {
      if (typeof name !== 'string') return;
      if (termLists[name]) merged.push(...termLists[name]);
      else {
        const guess = closest(name, Object.keys(termLists));
        const node = (cNodes.term_lists as unknown as { items?: Node[] })?.items?.[k];
        walker.at(node, `unknown term list "${name}"${guess ? ` — did you mean "${guess}"?` : Object.keys(termLists).length ? ` (lists: ${Object.keys(termLists).join(', ')})` : ' (the rubric defines no term_lists)'}`, cNodes.term_lists);
      }
    });
    if (check === 'lexicon' && merged.length) params.terms = [...((params.terms as LexiconTerm[] | undefined) ?? []), ...merged];
    if (check === 'readability' && raw.audience) {
      if (params.targetGrade === undefined && raw.audience.grade !== null && raw.audience.grade !== undefined) params.targetGrade = raw.audience.grade;
      if (params.tolerance === undefined && raw.audience.tolerance !== undefined) params.tolerance = raw.audience.tolerance;
    }
    if (typeof c.id !== 'string' || !check) return;
    criteria.push({
      id: c.id,
      check,
      description: c.description ?? null,
      weight: typeof c.weight === 'number' ? c.weight : 1,
      severity: c.severity ?? 'warn',
      bands: { pass: c.bands?.pass ?? 0.8, review: c.bands?.review ?? 0.5 },
      params,
    });
  });
  if (rawCriteria.length && rawCriteria.every((c) => c && typeof c.weight === 'number' && c.weight === 0)) {
    walker.at(nodes.criteria, 'every criterion has weight 0, so no score can be computed — give at least one criterion a weight above 0');
  }

  const ids = new Set(criteria.map((c) => c.id));
  const allIds = rawCriteria.map((c) => c?.id).filter((id): id is string => typeof id === 'string');
  const examples: RubricExample[] = [];
  ((raw.examples ?? []) as (Raw | undefined)[]).forEach((e) => {
    if (!e) return;
    const keyNodes = keysOf(e.expect);
    for (const name of Object.keys(e.expect ?? {})) {
      if (!allIds.includes(name)) {
        const guess = closest(name, allIds);
        walker.at(keyNodes[name], `example "${e.name}" expects a band for unknown criterion "${name}"${guess ? ` — did you mean "${guess}"?` : ''}`, nodesOf(e).expect);
      }
    }
    examples.push({ name: e.name, prompt: e.prompt, response: e.response, others: e.others ?? [], expect: (e.expect ?? {}) as Record<string, Band>, expectOverall: e.expect_overall ?? null });
  });

  const all = sortProblems(walker.problems);
  if (all.length || !ids.size) return { problems: all };
  return {
    problems: [],
    rubric: {
      id: raw.id,
      title: raw.title,
      description: raw.description ?? null,
      version: createHash('sha256').update(canonical(raw)).digest('hex').slice(0, 12),
      overallBands: { pass: raw.overall_bands?.pass ?? 75, review: raw.overall_bands?.review ?? 50 },
      criteria,
      triage: { edgeMargin: raw.triage?.edge_margin ?? 5, closeMargin: raw.triage?.close_margin ?? 3 },
      agreement: { reviews: raw.agreement?.reviews ?? 1, rule: raw.agreement?.rule ?? 'top', threshold: raw.agreement?.threshold ?? 0.75, blindFirst: raw.agreement?.blind_first ?? true },
      audience: { grade: raw.audience?.grade ?? null, tolerance: raw.audience?.tolerance ?? 2 },
      examples,
      source: text,
    },
  };
}

function checkBands(walker: ReturnType<typeof parseRubricText>['walker'], bands: Raw | undefined, node: Node | undefined, where: string): void {
  if (bands && typeof bands.pass === 'number' && typeof bands.review === 'number' && bands.review > bands.pass) {
    walker.at(node, `${where} out of order: review (${bands.review}) is above pass (${bands.pass}) — review must be at most pass`);
  }
}

function sortProblems(problems: Problem[]): Problem[] {
  return [...problems].sort((a, b) => a.line - b.line || a.column - b.column);
}

/** Reads and loads a rubric file; an unreadable file is a `UserError`. */
export function loadRubricFile(path: string): LoadResult & { path: string } {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = errorCode(error);
    throw new UserError(code === 'ENOENT' ? `${path}: no such rubric file — check the path` : `${path}: cannot read (${code ?? String(error)})`);
  }
  return { path, ...loadRubric(text) };
}

/** Formats a problem the way compilers do: `file:line:column: message`. */
export function formatProblem(path: string, p: Problem): string {
  return `${path}:${p.line}:${p.column}: ${p.message}`;
}
