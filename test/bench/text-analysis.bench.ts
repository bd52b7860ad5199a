import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { analyze, analyzeItem } from '../../src/text/analyze.ts';
import { runAllChecks } from '../../src/checks/run-checks.ts';
import { winkReader } from '../../src/text/wink-reader.ts';
import { prng, syntheticCorpus, syntheticResponse } from './corpus.ts';
import type { BenchRow } from './report.ts';

const PROMPT = 'How long should I boil stream water to make it safe to drink?';

function timeIt(run: () => void): number {
  const t0 = performance.now();
  run();
  return performance.now() - t0;
}

function analyseAndCheck(texts: string[]): void {
  const prompt = analyze(PROMPT);
  for (const text of texts) runAllChecks(analyze(text, { prompt }));
}

/**
 * Issue 3's figures: throughput of analysis plus every check against a bare wink-nlp read and
 * against npm text-readability's six grade formulas; cost growth with length; memory while
 * analysing a stream of responses.
 */
export async function textAnalysisBench(options: { quick: boolean }): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const count = options.quick ? 1000 : 5000;
  const corpus = syntheticCorpus(count, 1200);
  const bytes = corpus.reduce((n, t) => n + Buffer.byteLength(t), 0);
  analyseAndCheck(corpus.slice(0, 300)); // warm up: dictionary, model, memo tables, JIT

  const nlp = winkReader();
  // Rounds alternate a wink-nlp read and ours over the same texts; the figure is the median of
  // the rounds' ratios, since the two runs of a round see the same spell of load on a shared machine.
  const rounds = options.quick ? 5 : 7;
  const pairs: { wink: number; ours: number }[] = [];
  for (let round = 0; round < rounds; round++) {
    const wink = timeIt(() => {
      for (const t of corpus) nlp.readDoc(t);
    });
    pairs.push({ wink, ours: timeIt(() => analyseAndCheck(corpus)) });
  }
  const median = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1];
  const ratio = median(pairs.map((p) => p.wink / p.ours));
  const wink = median(pairs.map((p) => p.wink));
  const ours = median(pairs.map((p) => p.ours));
  const perSecond = (ms: number) => (count / ms) * 1000;
  rows.push({ area: 'analysis', name: `bare wink-nlp read (sbd, negation), ${count} responses, ${(bytes / count / 1024).toFixed(2)} KB avg (median of ${rounds} rounds)`, value: perSecond(wink), unit: 'responses/s' });
  rows.push({
    area: 'analysis',
    name: 'analyze + all 11 checks (ratio: median of the rounds\' ratios)',
    value: perSecond(ours),
    unit: 'responses/s',
    ratio,
    target: '≥ 0.5× wink read',
    pass: ratio >= 0.5,
    detail: pairs.map((p) => (p.wink / p.ours).toFixed(2)).join(' '),
  });

  // length growth: 1.2 KB vs 12 KB vs 50 KB
  const random = prng(11);
  const short = Array.from({ length: 200 }, () => syntheticResponse(random, 1200));
  const long = Array.from({ length: 20 }, () => syntheticResponse(random, 12_000));
  const huge = Array.from({ length: 5 }, () => syntheticResponse(random, 50_000));
  // rounds time the three sizes back to back; the growth figures are medians of the rounds' ratios
  const kbOf = (texts: string[]) => texts.reduce((n, t) => n + t.length, 0) / 1024;
  const sizes: { short: number; long: number; huge: number }[] = [];
  for (let round = 0; round < 5; round++) {
    sizes.push({
      short: timeIt(() => analyseAndCheck(short)) / kbOf(short),
      long: timeIt(() => analyseAndCheck(long)) / kbOf(long),
      huge: timeIt(() => analyseAndCheck(huge)) / kbOf(huge),
    });
  }
  const shortCost = median(sizes.map((g) => g.short));
  const longCost = shortCost * median(sizes.map((g) => g.long / g.short));
  const hugeCost = shortCost * median(sizes.map((g) => g.huge / g.short));
  const sentences = analyze(huge[0]).sentences.length;
  rows.push({ area: 'analysis', name: 'cost per KB, 1.2 KB responses', value: shortCost, unit: 'ms/KB' });
  rows.push({ area: 'analysis', name: '10× longer (12 KB): cost of 10× the text', value: (longCost / shortCost) * 10, unit: '× the cost', target: '≤ 15×', pass: (longCost / shortCost) * 10 <= 15 });
  rows.push({ area: 'analysis', name: `50 KB response (${sentences} sentences): cost of 42× the text`, value: (hugeCost / shortCost) * (50_000 / 1200), unit: '× the cost', target: 'linear (≤ 1.5 × 42 = 63×)', pass: hugeCost / shortCost <= 1.5 });

  // memory over a stream
  setFlagsFromString('--expose-gc');
  const gc = runInNewContext('gc') as () => void;
  const stream = options.quick ? 20_000 : 100_000;
  const streamRandom = prng(99);
  const heap: number[] = [];
  const t0 = performance.now();
  for (let i = 0; i < stream; i++) {
    const { responses } = analyzeItem(PROMPT, [syntheticResponse(streamRandom, 600)]);
    runAllChecks(responses[0]);
    if ((i + 1) % (stream / 10) === 0) {
      gc();
      heap.push(process.memoryUsage().heapUsed / 1024 / 1024);
    }
  }
  const seconds = (performance.now() - t0) / 1000;
  const growth = Math.max(...heap.slice(1)) - heap[0];
  rows.push({ area: 'analysis', name: `heap after GC over a stream of ${stream.toLocaleString('en')} responses (${seconds.toFixed(0)} s): first tenth → max later`, value: growth, unit: 'MB growth', target: 'flat (< 20 MB growth)', pass: growth < 20, detail: heap.map((h) => h.toFixed(0)).join(' ') });

  // text-readability last: it adds functions to the global Math object. Rounds alternate again.
  const { default: textReadability } = await import('text-readability');
  const referencePairs: { reference: number; ours: number }[] = [];
  for (let round = 0; round < 3; round++) {
    const reference = timeIt(() => {
      for (const t of corpus) {
        textReadability.fleschKincaidGrade(t);
        textReadability.gunningFog(t);
        textReadability.smogIndex(t);
        textReadability.colemanLiauIndex(t);
        textReadability.automatedReadabilityIndex(t);
        textReadability.daleChallReadabilityScore(t);
      }
    });
    referencePairs.push({ reference, ours: timeIt(() => analyseAndCheck(corpus)) });
  }
  const referenceRatio = median(referencePairs.map((p) => p.reference / p.ours));
  rows.push({ area: 'analysis', name: 'npm text-readability, six grade formulas (median of 3 rounds)', value: perSecond(median(referencePairs.map((p) => p.reference))), unit: 'responses/s' });
  rows.push({ area: 'analysis', name: 'analyze + all checks vs text-readability (median of the rounds\' ratios)', value: perSecond(median(referencePairs.map((p) => p.ours))), unit: 'responses/s', ratio: referenceRatio, target: '≥ 5× text-readability', pass: referenceRatio >= 5 });
  return rows;
}
