import type { Doc } from '../text/analyze.ts';
import type { CheckResult } from './define-check.ts';
import { CHECKS } from './registry.ts';

/**
 * Runs every check on an analysed text with each check's default parameters (or the given
 * overrides, keyed by check id). The text is analysed once; every check reads the same `Doc`.
 */
export function runAllChecks(doc: Doc, params: Record<string, Record<string, unknown>> = {}): Record<string, CheckResult> {
  const out: Record<string, CheckResult> = {};
  for (const check of CHECKS) out[check.meta.id] = check.run(doc, params[check.meta.id]);
  return out;
}
