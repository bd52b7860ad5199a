/**
 * Trains the syllable fallback model on nine tenths of CMU's alphabetic headwords (the tenth
 * chosen by `isHeldOut` is never seen, so tests can measure the model on it) and writes
 * `syllable-model.json`. Run with `npm run build:syllables`; the output is committed.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { cmuAlphabeticEntries, isHeldOut } from './cmu-syllables.ts';
import { estimateSyllables, syllableFeatures } from './syllable-features.ts';

export function trainSyllableWeights(entries: [string, number][], epochs = 12): Map<string, number> {
  const encoded = entries.map(([word, target]) => ({ features: syllableFeatures(word), target }));
  const counts = new Map<string, number>();
  for (const e of encoded) for (const f of e.features) counts.set(f, (counts.get(f) ?? 0) + 1);
  const weights = new Map<string, number>();
  for (const f of counts.keys()) weights.set(f, f.startsWith('G:') ? 1 : 0);
  for (let epoch = 0; epoch < epochs; epoch++) {
    const rate = 0.08 / (1 + epoch * 0.5);
    for (const e of encoded) {
      let sum = 0;
      for (const f of e.features) sum += weights.get(f)!;
      const step = (rate * (e.target - sum)) / e.features.length;
      for (const f of e.features) weights.set(f, weights.get(f)! + step);
    }
  }
  // Drop features seen fewer than 3 times or with negligible weight: a smaller file, same accuracy.
  for (const [f, w] of weights) if (counts.get(f)! < 3 || Math.abs(w) < 0.005) weights.delete(f);
  return weights;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const all = cmuAlphabeticEntries();
  const train = all.filter(([w]) => !isHeldOut(w));
  const test = all.filter(([w]) => isHeldOut(w));
  const weights = trainSyllableWeights(train);
  const accuracy = (set: [string, number][]) => set.filter(([w, n]) => estimateSyllables(w, weights) === n).length / set.length;
  const rounded = Object.fromEntries([...weights].sort(([a], [b]) => (a < b ? -1 : 1)).map(([f, w]) => [f, Math.round(w * 1000) / 1000]));
  const out = fileURLToPath(new URL('./syllable-model.json', import.meta.url));
  writeFileSync(out, `${JSON.stringify({ trainedOn: train.length, heldOut: test.length, features: rounded })}\n`);
  console.log(`features ${weights.size}; train accuracy ${(accuracy(train) * 100).toFixed(2)}%; held-out ${(accuracy(test) * 100).toFixed(2)}% on ${test.length} words`);
}
