import { cairnfieldItems } from '../../src/demo/cairnfield-items.ts';

import { seededRandom } from '../../src/stats/seeded-random.ts';

/** The seeded generator, so every run measures the same corpus. */
export const prng = seededRandom;

const sentences = cairnfieldItems.flatMap((item) => item.responses.flatMap((r) => r.split(/(?<=[.!?])\s+/))).filter((s) => s.length > 10);

/** A generated response of about `bytes` characters, built from the demo's sentences. */
export function syntheticResponse(random: () => number, bytes: number): string {
  const parts: string[] = [];
  let length = 0;
  while (length < bytes) {
    const s = sentences[Math.floor(random() * sentences.length)];
    parts.push(s);
    length += s.length + 1;
    if (random() < 0.12) {
      parts.push('\n\n');
      length += 2;
    }
  }
  return parts.join(' ');
}

/** `count` responses averaging about `bytes` characters (uniform from half to one and a half). */
export function syntheticCorpus(count: number, bytes: number, seed = 7): string[] {
  const random = prng(seed);
  return Array.from({ length: count }, () => syntheticResponse(random, Math.round(bytes * (0.5 + random()))));
}
