/** The severities a flag on an imported item may carry, lowest first. */
export const FLAG_SEVERITIES = ['low', 'medium', 'high', 'critical'] as const;
export type FlagSeverity = (typeof FLAG_SEVERITIES)[number];

/** 0 for no flag, 1–4 for low … critical; used by the triage order. */
export function flagWeight(severity: string | null | undefined): number {
  const index = FLAG_SEVERITIES.indexOf((severity ?? '') as FlagSeverity);
  return index + 1;
}
