import { seededRandom } from './seeded-random.ts';
/**
 * A percentile bootstrap confidence interval: resample the units with replacement `rounds`
 * times (a seeded generator, so the interval is reproducible), compute the statistic on each
 * resample, and take the (1 − level)/2 and (1 + level)/2 quantiles. Resamples where the
 * statistic is undefined are skipped; null when none is defined.
 */
export function bootstrapInterval<T>(units: readonly T[], statistic: (sample: T[]) => number | null, options: { rounds?: number; level?: number; seed?: number } = {}): { low: number; high: number } | null {
  if (!units.length) return null;
  const rounds = options.rounds ?? 1000;
  const level = options.level ?? 0.95;
  const random = seededRandom(options.seed ?? 7);
  const values: number[] = [];
  for (let r = 0; r < rounds; r++) {
    const sample = Array.from({ length: units.length }, () => units[Math.floor(random() * units.length)]);
    const v = statistic(sample);
    if (v !== null && Number.isFinite(v)) values.push(v);
  }
  if (!values.length) return null;
  values.sort((x, y) => x - y);
  const at = (q: number) => values[Math.min(values.length - 1, Math.max(0, Math.round(q * (values.length - 1))))];
  return { low: at((1 - level) / 2), high: at((1 + level) / 2) };
}
