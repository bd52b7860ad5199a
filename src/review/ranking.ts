import type { Ranks } from '../stats/pairwise-agreement.ts';

/**
 * Checks a ranking of an item's responses: every response ranked exactly once, ranks whole
 * numbers from 1 to the number of responses, ties allowed. Returns what is wrong, or null.
 *
 * @example
 * rankingProblem({ a: 1, b: 1, c: 3 }, ['a', 'b', 'c']) // null (a and b tie)
 */
export function rankingProblem(ranking: Ranks, responseIds: readonly string[]): string | null {
  const ranked = Object.keys(ranking);
  const missing = responseIds.filter((id) => !(id in ranking));
  if (missing.length) return `rank every response: ${missing.join(', ')} ${missing.length === 1 ? 'has' : 'have'} no rank`;
  const extra = ranked.filter((id) => !responseIds.includes(id));
  if (extra.length) return `${extra.join(', ')} ${extra.length === 1 ? 'is' : 'are'} not a response of this item`;
  for (const [id, rank] of Object.entries(ranking)) {
    if (!Number.isInteger(rank) || rank < 1 || rank > responseIds.length) return `rank of ${id} must be a whole number from 1 to ${responseIds.length}, not ${rank}`;
  }
  return null;
}

/** The responses ranked first (several when tied). */
export function topChoice(ranking: Ranks): string[] {
  const best = Math.min(...Object.values(ranking));
  return Object.keys(ranking).filter((id) => ranking[id] === best).sort();
}

/** Competition ranks ("1, 2, 2, 4") of the mean rank each response got from several rankings. */
export function meanRanking(rankings: Ranks[]): Ranks {
  const ids = Object.keys(rankings[0] ?? {});
  const mean = Object.fromEntries(ids.map((id) => [id, rankings.reduce((a, r) => a + r[id], 0) / rankings.length]));
  return Object.fromEntries(ids.map((id) => [id, 1 + ids.filter((o) => mean[o] < mean[id] - 1e-9).length]));
}
