import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.ts';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-stats-'));

describe('plumbline stats agreement', () => {
  it("prints Krippendorff (2011)'s values for its reliability data as JSON", () => {
    const U = null;
    const observers = [
      [1, 2, 3, 3, 2, 1, 4, 1, 2, U, U, U],
      [1, 2, 3, 3, 2, 2, 4, 1, 2, 5, U, 3],
      [U, 3, 3, 3, 2, 3, 4, 2, 2, 5, 1, U],
      [1, 2, 3, 3, 2, 4, 4, 1, 2, 5, 1, U],
    ];
    const rows = observers.flatMap((o, r) => o.map((v, u) => `u${u + 1},${'ABCD'[r]},${v ?? ''}`));
    const file = join(dir, 'k.csv');
    writeFileSync(file, ['unit,rater,value', ...rows].join('\n'));
    const result = runCli(['stats', 'agreement', file, '--json']);
    expect(result.code).toBe(0);
    const out = JSON.parse(result.stdout);
    expect(out.krippendorff_alpha.nominal).toBeCloseTo(0.743, 3);
    expect(out.krippendorff_alpha.ordinal).toBeCloseTo(0.815, 3);
    expect(out.krippendorff_alpha.interval).toBeCloseTo(0.849, 3);
    expect(out.krippendorff_alpha.ratio).toBeCloseTo(0.797, 3);
    expect(out).toHaveProperty('fleiss_kappa');
    expect(out).not.toHaveProperty('kendall_w'); // not every rater rated every unit
    expect(out.pairwise_agreement).toBeGreaterThan(0);
  });

  it('adds Kendall\'s W and Fleiss\' kappa when every rater rated every unit', () => {
    const file = join(dir, 'full.csv');
    writeFileSync(file, 'unit,rater,value\na,r1,1\na,r2,1\nb,r1,2\nb,r2,2\nc,r1,3\nc,r2,2\n');
    const out = JSON.parse(runCli(['stats', 'agreement', file, '--json']).stdout);
    expect(out.kendall_w).toBeGreaterThan(0.8);
    expect(typeof out.fleiss_kappa).toBe('number');
  });

  it('names the line of a bad value', () => {
    const file = join(dir, 'bad.csv');
    writeFileSync(file, 'unit,rater,value\na,r1,1\na,r2,high\n');
    const result = runCli(['stats', 'agreement', file]);
    expect(result.code).toBe(1);
    expect(result.stderr.trim()).toBe(`plumbline: ${file}:3: value "high" is not a number — code categories as numbers (leave the value empty, or ".", for a missing one)`);
  });
});

describe('plumbline stats strengths', () => {
  it('prints Bradley–Terry strengths for the REFERENCES.md worked example', () => {
    const wins = [[0, 2, 0, 1], [3, 0, 5, 0], [0, 3, 0, 1], [4, 0, 3, 0]];
    const rows: string[] = [];
    wins.forEach((row, i) => row.forEach((n, j) => { for (let k = 0; k < n; k++) rows.push(`${'ABCD'[i]},${'ABCD'[j]}`); }));
    const file = join(dir, 'bt.csv');
    writeFileSync(file, ['winner,loser', ...rows].join('\n'));
    const out = JSON.parse(runCli(['stats', 'strengths', file, '--json']).stdout);
    expect(out.comparisons).toBe(22);
    expect(out.strengths.A).toBeCloseTo(0.64, 3);
    expect(out.strengths.D).toBeCloseTo(2.27, 3);
  });

  it('explains a comparison graph that is not strongly connected', () => {
    const file = join(dir, 'disconnected.csv');
    writeFileSync(file, 'winner,loser\nA,B\nA,C\n');
    const result = runCli(['stats', 'strengths', file]);
    expect(result.code).toBe(1);
    expect(result.stderr).toMatch(/^plumbline: the comparisons are not strongly connected — .* add comparisons between these groups\n$/);
  });
});

describe('plumbline stats calibrate', () => {
  it('reports on the demo batch\'s decided items', async () => {
    const { openStore } = await import('../../src/store/connect.ts');
    const { migrate } = await import('../../src/store/migrate.ts');
    const { seedDemo, DEMO_BATCH_NAME } = await import('../../src/demo/seed.ts');
    const db = join(dir, 'calibrate.db');
    const store = await openStore({ kind: 'sqlite', file: db });
    await migrate(store);
    await seedDemo(store.db, { password: () => 'pw-cal-123' });
    await store.close();
    const result = runCli(['stats', 'calibrate', '--batch', DEMO_BATCH_NAME, '--json'], { env: { PLUMBLINE_DB: db } });
    expect(result.code, result.stderr).toBe(0);
    const out = JSON.parse(result.stdout);
    expect(out.items).toBeGreaterThanOrEqual(5);
    expect(out.suggestedOrder.value).toBeGreaterThan(0);
    expect(Object.keys(out.criteria)).toContain('no-customer-data');
    expect(out.positionBias.pairs).toBeGreaterThan(0);
  });
});
