import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqliteFactory } from '../helpers/stores.ts';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo, DEMO_BATCH_NAME } from '../../src/demo/seed.ts';
import { compareRubrics, loadBatchItems } from '../../src/rubric/impact.ts';
import { loadRubric, type Rubric } from '../../src/rubric/load.ts';
import { currentRubric } from '../../src/store/repos/rubrics.ts';
import { findBatchByName } from '../../src/store/repos/batches.ts';
import { pairwiseAgreement } from '../../src/stats/pairwise-agreement.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let current: Rubric;
let draft: Rubric;
let batchId: number;

beforeAll(async () => {
  store = await factory.open();
  await migrate(store);
  await seedDemo(store.db, { password: () => 'pw-impact-1' });
  current = (await currentRubric(store.db, 'cairnfield-support'))!;
  draft = loadRubric(current.source.replace('overall_bands: { pass: 80, review: 55 }', 'overall_bands: { pass: 90, review: 70 }')).rubric!;
  batchId = (await findBatchByName(store.db, DEMO_BATCH_NAME))!.id;
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

describe('impact preview', () => {
  it('uses the stored scores of the rubric in force and gets what re-scoring gets', async () => {
    const withStored = await loadBatchItems(store.db, batchId, current);
    expect(withStored.every((i) => i.stored !== null)).toBe(true);
    const fresh = await loadBatchItems(store.db, batchId);
    const a = compareRubrics(current, draft, withStored);
    const b = compareRubrics(current, draft, fresh);
    expect(a.bandChanges).toEqual(b.bandChanges);
    expect(a.orderChanges).toEqual(b.orderChanges);
    expect(a.moves.map((m) => m.promptId)).toEqual(b.moves.map((m) => m.promptId));
    expect(a.humanAgreement).toEqual(b.humanAgreement);
  });

  it('reports band changes when the bands move, and none for the same rubric', async () => {
    const items = await loadBatchItems(store.db, batchId, current);
    const impact = compareRubrics(current, draft, items);
    expect(impact.items).toBe(40);
    expect(impact.bandChanges.length).toBeGreaterThan(0);
    expect(impact.bandChanges.every((c) => ['pass', 'review', 'fail'].indexOf(c.after) >= ['pass', 'review', 'fail'].indexOf(c.before))).toBe(true);
    expect(impact.humanAgreement.items).toBeGreaterThanOrEqual(5);
    const none = compareRubrics(current, current, items);
    expect([none.moves.length, none.bandChanges.length, none.orderChanges.length]).toEqual([0, 0, 0]);
  });
});

describe('pairwise agreement of two rankings', () => {
  const table: [Record<string, number>, Record<string, number>, number | null, string][] = [
    [{ a: 1, b: 2, c: 3 }, { a: 1, b: 2, c: 3 }, 1, 'same order'],
    [{ a: 1, b: 2, c: 3 }, { a: 3, b: 2, c: 1 }, 0, 'reversed'],
    [{ a: 1, b: 2, c: 3 }, { a: 1, b: 3, c: 2 }, 2 / 3, 'one pair swapped of three'],
    [{ a: 1, b: 1, c: 2 }, { a: 2, b: 1, c: 3 }, 1, 'reference ties are left out'],
    [{ a: 1, b: 2 }, { a: 1, b: 1 }, 0.5, 'a tie in the other ranking counts half'],
    [{ a: 1, b: 1 }, { a: 1, b: 2 }, null, 'nothing comparable'],
  ];
  for (const [reference, other, expected, name] of table) it(name, () => expect(pairwiseAgreement(reference, other)).toBe(expected));
});
