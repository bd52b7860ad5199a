import { describe, expect, it } from 'vitest';
import { analyze, type Doc } from '../../src/text/analyze.ts';
import type { Check } from '../../src/checks/define-check.ts';

export interface CaseContext {
  prompt?: string;
  siblings?: string[];
  params?: Record<string, unknown>;
}

/** A text that must be flagged, with the findings it must carry (message id and exact evidence). */
export interface FlaggedCase extends CaseContext {
  text: string;
  expect: { message: string; evidence: string }[];
}

/** A text that must not be flagged: a plain string, or one with context. */
export type CleanCase = string | (CaseContext & { text: string });

function docFor(text: string, context: CaseContext): Doc {
  const prompt = context.prompt !== undefined ? analyze(context.prompt) : undefined;
  const doc = analyze(text, { prompt });
  if (context.siblings) doc.context.siblings = context.siblings.map((s) => analyze(s, { prompt }));
  return doc;
}

/**
 * Runs a check's table: every flagged case must produce each expected finding at exactly the
 * span of one occurrence of its evidence in the text; every clean case must produce none.
 * An expectation naming a message id the check does not declare fails the table.
 */
export function checkTable(check: Check<any>, table: { flagged: FlaggedCase[]; clean: CleanCase[] }) {
  describe(`${check.meta.id}: flagged`, () => {
    for (const c of table.flagged) {
      it(c.text.slice(0, 90), () => {
        const result = check.run(docFor(c.text, c), c.params);
        for (const e of c.expect) {
          expect(Object.keys(check.meta.messages), `unknown message id "${e.message}"`).toContain(e.message);
          const starts: number[] = [];
          for (let at = c.text.indexOf(e.evidence); at >= 0; at = c.text.indexOf(e.evidence, at + 1)) starts.push(at);
          expect(starts.length, `evidence "${e.evidence}" is not in the text`).toBeGreaterThan(0);
          const hit = result.findings.find((f) => f.message === e.message && starts.includes(f.start) && f.end === f.start + e.evidence.length);
          expect(hit, `expected ${e.message} at "${e.evidence}", got ${JSON.stringify(result.findings.map((f) => [f.message, f.evidence]))}`).toBeDefined();
          expect(hit!.evidence).toBe(e.evidence);
        }
      });
    }
  });
  describe(`${check.meta.id}: not flagged`, () => {
    for (const c of table.clean) {
      const text = typeof c === 'string' ? c : c.text;
      const context: CaseContext = typeof c === 'string' ? {} : c;
      it(text.slice(0, 90) || '(empty)', () => {
        const result = check.run(docFor(text, context), context.params);
        expect(result.findings.map((f) => `${f.message}: ${f.evidence}`)).toEqual([]);
      });
    }
  });
}
