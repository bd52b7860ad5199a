import type { Doc } from '../text/analyze.ts';

export type ParamType = 'number' | 'integer' | 'boolean' | 'string' | 'string[]' | 'terms' | 'topics';

/** One parameter a check accepts: its type, default and limits, for the rubric validator and the docs. */
export interface ParamSpec {
  type: ParamType;
  default: unknown;
  min?: number;
  max?: number;
  /** May be null (for example "no target grade"). */
  nullable?: boolean;
  description: string;
}

export interface CheckMeta {
  id: string;
  description: string;
  params: Record<string, ParamSpec>;
  /** Message ids and their templates; `{name}` is filled from the finding's data. */
  messages: Record<string, string>;
}

/** A finding: `[start, end)` slices the original text to exactly `evidence`. */
export interface Finding {
  start: number;
  end: number;
  message: string;
  text: string;
  evidence: string;
  data?: Record<string, string | number>;
  /** A second span the finding refers to (the earlier sentence of a contradiction). */
  related?: { start: number; end: number; evidence: string };
}

export type MetricValue = number | string | null;

export interface CheckResult {
  metrics: Record<string, MetricValue>;
  /** Why a metric is null, keyed by metric name. */
  undefinedMetrics: Record<string, string>;
  /** 1 fully meets the criterion, 0 not at all. */
  value: number;
  findings: Finding[];
}

export interface Span {
  start: number;
  end: number;
}

export type Report = (message: string, span: Span, data?: Record<string, string | number>, related?: Span) => void;

/** What a check's body returns; findings go through `report`. */
export interface Evaluation {
  metrics: Record<string, MetricValue>;
  value: number;
  /** Reasons for metrics that are null. */
  undefinedMetrics?: Record<string, string>;
}

export interface CheckDefinition<P> {
  meta: CheckMeta;
  evaluate(doc: Doc, params: P, report: Report): Evaluation;
}

export interface Check<P = Record<string, unknown>> {
  meta: CheckMeta;
  /** Runs the check with `params` laid over the defaults. */
  run(doc: Doc, params?: Partial<P>): CheckResult;
  defaults(): P;
}

/**
 * Declares a check. The body only reports message ids and spans; `run` fills message text
 * and evidence, refuses unknown message ids, turns NaN or infinite metrics into null with a
 * reason, and clamps the value to [0, 1].
 *
 * @example
 * export const shout = defineCheck({ meta: {...}, evaluate(doc, params, report) { ...; return { metrics, value } } });
 */
export function defineCheck<P>(definition: CheckDefinition<P>): Check<P> {
  const { meta } = definition;
  // Built once and shared: parameters are read-only, and phrase lists are compiled per list object.
  const defaultParams = Object.freeze(Object.fromEntries(Object.entries(meta.params).map(([k, spec]) => [k, spec.default]))) as P;
  return {
    meta,
    defaults: () => defaultParams,
    run(doc, params) {
      const resolved = params ? ({ ...defaultParams, ...params } as P) : defaultParams;
      const findings: Finding[] = [];
      const report: Report = (message, span, data, related) => {
        const template = meta.messages[message];
        if (template === undefined) throw new Error(`check "${meta.id}" reported unknown message id "${message}"`);
        const start = Math.max(0, Math.min(span.start, doc.text.length));
        const end = Math.max(start, Math.min(span.end, doc.text.length));
        const finding: Finding = { start, end, message, text: fill(template, data), evidence: doc.text.slice(start, end) };
        if (data) finding.data = data;
        if (related) finding.related = { start: related.start, end: related.end, evidence: doc.text.slice(related.start, related.end) };
        findings.push(finding);
      };
      const evaluation = definition.evaluate(doc, resolved, report);
      // the evaluation's own objects are returned unless a metric must become null
      let metrics = evaluation.metrics;
      let undefinedMetrics = evaluation.undefinedMetrics ?? {};
      for (const key in evaluation.metrics) {
        const value = evaluation.metrics[key];
        if (typeof value !== 'number' || Number.isFinite(value)) continue;
        if (metrics === evaluation.metrics) {
          metrics = { ...evaluation.metrics };
          undefinedMetrics = { ...undefinedMetrics };
        }
        metrics[key] = null;
        undefinedMetrics[key] ??= 'not defined for this text';
      }
      const value = Number.isFinite(evaluation.value) ? Math.min(1, Math.max(0, evaluation.value)) : 1;
      if (findings.length > 1) findings.sort((a, b) => a.start - b.start || a.end - b.end);
      return { metrics, undefinedMetrics, value, findings };
    },
  };
}

function fill(template: string, data: Record<string, string | number> | undefined): string {
  if (!template.includes('{')) return template;
  return template.replace(/\{(\w+)\}/g, (whole, name: string) => {
    const value = data?.[name];
    if (value === undefined) throw new Error(`message template "${template}" needs "${name}"`);
    return String(value);
  });
}

/** Placeholders a template uses, for the completeness test. */
export function placeholdersOf(template: string): string[] {
  return [...template.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
}
