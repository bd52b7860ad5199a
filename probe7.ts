import { winkReader } from './src/text/wink-reader.ts';
import { syllablesOf } from './src/text/syllables.ts';
for (const n of [10_000, 50_000, 100_000]) {
  const text = 'x'.repeat(n);
  let t0 = performance.now();
  const d = winkReader().readDoc(text);
  const v = d.tokens().out(winkReader().its.value);
  console.log(n, 'wink', (performance.now() - t0).toFixed(0), v.length);
  t0 = performance.now(); syllablesOf(text); console.log(n, 'syl', (performance.now() - t0).toFixed(0));
  const t2 = 'word '.repeat(n / 5);
  t0 = performance.now(); winkReader().readDoc(t2); console.log(n, 'wink words', (performance.now() - t0).toFixed(0));
}
