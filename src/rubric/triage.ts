import { flagWeight } from '../review/flag-severity.ts';
import type { Rubric } from './load.ts';
import type { ResponseScore } from './score.ts';

/** An item's place in the queue and why. */
export interface Priority {
  /** Higher is read first. */
  value: number;
  /** Some response has a finding from a critical criterion. */
  critical: boolean;
  /** 0–1: how close scores sit to a band edge or to each other. */
  uncertainty: number;
  /** The flag's severity, 0 (none) to 4 (critical). */
  flag: number;
}

/**
 * The triage policy: items with critical findings first; then the most uncertain (a score within
 * `edgeMargin` points of a band edge, or two candidates within `closeMargin` points of each other —
 * the nearer, the more uncertain); then by flag severity. Age breaks the remaining ties in the
 * queue (oldest first). The value is lexicographic: critical · 1000 + uncertainty in whole
 * percent + flag / 10.
 */
export function triagePriority(rubric: Rubric, responses: ResponseScore[], flagSeverity: string | null): Priority {
  const critical = responses.some((r) => r.findings.some((f) => f.severity === 'critical'));
  const edges = [rubric.overallBands.pass, rubric.overallBands.review];
  let uncertainty = 0;
  const { edgeMargin, closeMargin } = rubric.triage;
  for (const r of responses) {
    const distance = Math.min(...edges.map((e) => Math.abs(r.score - e)));
    if (edgeMargin > 0) uncertainty = Math.max(uncertainty, 1 - distance / edgeMargin);
  }
  const scores = responses.map((r) => r.score).sort((a, b) => b - a);
  for (let i = 1; i < scores.length && closeMargin > 0; i++) {
    uncertainty = Math.max(uncertainty, 1 - (scores[i - 1] - scores[i]) / closeMargin);
  }
  uncertainty = Math.max(0, Math.min(1, uncertainty));
  const flag = flagWeight(flagSeverity);
  return { value: (critical ? 1000 : 0) + Math.round(uncertainty * 100) + flag / 10, critical, uncertainty: Math.round(uncertainty * 1000) / 1000, flag };
}
