import type { MetricValue } from '../checks/define-check.ts';
import { findCheck } from '../checks/registry.ts';
import { analyzeItem } from '../text/analyze.ts';
import type { BandEdges, Rubric } from './load.ts';
import type { Band, Severity } from './spec.ts';
import { triagePriority, type Priority } from './triage.ts';

export interface CriterionScore {
  value: number;
  band: Band;
  metrics: Record<string, MetricValue>;
}

/** A finding as the rubric reports it: the check's finding plus criterion and severity. */
export interface ScoredFinding {
  criterion: string;
  check: string;
  start: number;
  end: number;
  severity: Severity;
  messageId: string;
  message: string;
  evidence: string;
  related?: { start: number; end: number; evidence: string };
}

export interface ResponseScore {
  responseId: string;
  /** 100 · Σ wᵢvᵢ / Σ wᵢ, rounded to one decimal. */
  score: number;
  band: Band;
  /** A critical criterion failed: the response fails whatever its score. */
  failedCritical: boolean;
  /** 1 is best; responses that score alike share a rank. */
  suggestedRank: number;
  criteria: Record<string, CriterionScore>;
  findings: ScoredFinding[];
}

export interface ItemScore {
  rubric: { id: string; version: string };
  responses: ResponseScore[];
  priority: Priority;
}

export interface ItemToScore {
  prompt: string;
  responses: { responseId: string; text: string }[];
  flagSeverity?: string | null;
}

/** The band a value falls in: at or above `pass` passes, at or above `review` is reviewed, else fails. */
export function bandOf(value: number, edges: BandEdges): Band {
  return value >= edges.pass ? 'pass' : value >= edges.review ? 'review' : 'fail';
}

/**
 * Scores every response of an item against a rubric. Each text is analysed once and every
 * criterion's check reads that analysis. Overall score = 100 · Σ wᵢvᵢ / Σ wᵢ; a failed critical
 * criterion fails the response whatever the sum; the suggested order ranks responses that failed
 * a critical criterion last and the rest by score; the item's priority follows the triage policy.
 *
 * @example
 * const scored = scoreItem(rubric, { prompt: 'How long…?', responses: [{ responseId: 'a', text: '…' }] });
 */
export function scoreItem(rubric: Rubric, item: ItemToScore): ItemScore {
  const { responses: docs } = analyzeItem(item.prompt, item.responses.map((r) => r.text));
  const totalWeight = rubric.criteria.reduce((n, c) => n + c.weight, 0);
  const responses: ResponseScore[] = docs.map((doc, i) => {
    const criteria: Record<string, CriterionScore> = {};
    const findings: ScoredFinding[] = [];
    let weighted = 0;
    let failedCritical = false;
    for (const criterion of rubric.criteria) {
      const result = findCheck(criterion.check)!.run(doc, criterion.params);
      const band = bandOf(result.value, criterion.bands);
      criteria[criterion.id] = { value: round(result.value, 4), band, metrics: result.metrics };
      weighted += criterion.weight * result.value;
      if (criterion.severity === 'critical' && band === 'fail') failedCritical = true;
      for (const f of result.findings) {
        findings.push({ criterion: criterion.id, check: criterion.check, start: f.start, end: f.end, severity: criterion.severity, messageId: f.message, message: f.text, evidence: f.evidence, ...(f.related ? { related: f.related } : {}) });
      }
    }
    const score = round(totalWeight ? (100 * weighted) / totalWeight : 100, 1);
    findings.sort((a, b) => a.start - b.start || a.end - b.end);
    return { responseId: item.responses[i].responseId, score, band: failedCritical ? 'fail' : bandOf(score, rubric.overallBands), failedCritical, suggestedRank: 0, criteria, findings };
  });
  for (const r of responses) {
    r.suggestedRank = 1 + responses.filter((o) => better(o, r)).length;
  }
  return { rubric: { id: rubric.id, version: rubric.version }, responses, priority: triagePriority(rubric, responses, item.flagSeverity ?? null) };
}

function better(a: ResponseScore, b: ResponseScore): boolean {
  if (a.failedCritical !== b.failedCritical) return !a.failedCritical;
  return a.score > b.score;
}

function round(x: number, places: number): number {
  const f = 10 ** places;
  return Math.round(x * f) / f;
}
