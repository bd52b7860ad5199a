import type { Check } from './define-check.ts';
import { certainty } from './certainty.ts';
import { consistency } from './consistency.ts';
import { contradiction } from './contradiction.ts';
import { format } from './format.ts';
import { lexicon } from './lexicon.ts';
import { nonAnswer } from './non-answer.ts';
import { personalData } from './personal-data.ts';
import { readability } from './readability.ts';
import { refusal } from './refusal.ts';
import { repetition } from './repetition.ts';
import { safetyCaveat } from './safety-caveat.ts';

/** Every check, sorted by id. A rubric criterion names one of these ids. */
export const CHECKS: readonly Check<any>[] = [certainty, consistency, contradiction, format, lexicon, nonAnswer, personalData, readability, refusal, repetition, safetyCaveat];

export const CHECK_IDS = CHECKS.map((c) => c.meta.id);

/** The check with this id, or undefined. */
export function findCheck(id: string): Check<any> | undefined {
  return CHECKS.find((c) => c.meta.id === id);
}
