import { pairwiseAgreement, type Ranks } from '../stats/pairwise-agreement.ts';
import { meanRanking, topChoice } from './ranking.ts';

export interface ConsensusRule {
  kind: 'top' | 'pairwise';
  threshold?: number;
}

export type Verdict = { agreed: true; ranking: Ranks; agreement: number } | { agreed: false; agreement: number; why: string };

/** Mean pairwise agreement over every pair of rankings (1 for a single ranking). */
export function meanPairwiseAgreement(rankings: Ranks[]): number {
  const values: number[] = [];
  for (let i = 0; i < rankings.length; i++) {
    for (let j = i + 1; j < rankings.length; j++) {
      const a = pairwiseAgreement(rankings[i], rankings[j]) ?? 1;
      const b = pairwiseAgreement(rankings[j], rankings[i]) ?? 1;
      values.push((a + b) / 2);
    }
  }
  return values.length ? values.reduce((x, y) => x + y, 0) / values.length : 1;
}

/**
 * Applies a batch's consensus rule to its reviewers' rankings. `top`: every reviewer chose the
 * same first place (the same set, when tied). `pairwise`: the reviewers order at least
 * `threshold` of the pairs alike. Agreeing reviews become the final ranking by mean rank;
 * disagreeing ones go to adjudication.
 */
export function applyConsensus(rankings: Ranks[], rule: ConsensusRule): Verdict {
  const agreement = meanPairwiseAgreement(rankings);
  if (rule.kind === 'top') {
    const tops = rankings.map((r) => topChoice(r).join(','));
    if (tops.every((t) => t === tops[0])) return { agreed: true, ranking: meanRanking(rankings), agreement };
    return { agreed: false, agreement, why: `different first choices (${[...new Set(tops)].join(' / ')})` };
  }
  const threshold = rule.threshold ?? 0.75;
  if (agreement >= threshold) return { agreed: true, ranking: meanRanking(rankings), agreement };
  return { agreed: false, agreement, why: `pairwise agreement ${(agreement * 100).toFixed(0)}% is below ${(threshold * 100).toFixed(0)}%` };
}
