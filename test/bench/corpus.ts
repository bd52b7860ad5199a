import { cairnfieldItems } from '../../src/demo/cairnfield-items.ts';

/** A small deterministic PRNG (mulberry32), so every run measures the same corpus. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

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
