import type { Rubric, RubricExample } from './load.ts';
import { scoreItem } from './score.ts';
import type { Band } from './spec.ts';

export interface ExampleResult {
  example: RubricExample;
  /** One line per expectation that did not hold. */
  failures: string[];
}

/** Scores each of a rubric's examples and compares the bands with what the example expects. */
export function runExamples(rubric: Rubric): ExampleResult[] {
  return rubric.examples.map((example) => {
    const scored = scoreItem(rubric, {
      prompt: example.prompt,
      responses: [example.response, ...example.others].map((text, i) => ({ responseId: String(i), text })),
    });
    const response = scored.responses[0];
    const failures: string[] = [];
    for (const [criterion, expected] of Object.entries(example.expect)) {
      const got = response.criteria[criterion];
      if (got && got.band !== expected) {
        const why = response.findings.filter((f) => f.criterion === criterion).map((f) => f.message);
        failures.push(`${criterion}: expected ${expected}, got ${got.band} (value ${got.value})${why.length ? ` — ${why.slice(0, 2).join('; ')}` : ''}`);
      }
    }
    if (example.expectOverall && response.band !== example.expectOverall) {
      failures.push(`overall: expected ${example.expectOverall}, got ${response.band} (score ${response.score})`);
    }
    return { example, failures };
  });
}

export type { Band };
