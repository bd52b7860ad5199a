import { hostname } from 'node:os';
import { describe, expect, it } from 'vitest';
import { IMPORT_STALE_MS, importOwner, sweepUnfinishedImports } from '../../src/store/repos/unfinished-imports.ts';
import type { Store } from '../../src/store/connect.ts';
import { storeFactories, useMigratedStore } from '../helpers/stores.ts';

const NOW = Date.parse('2026-12-02T12:00:00Z');
const iso = (ms: number) => new Date(ms).toISOString();
/** A pid no process has: above Linux's pid_max ceiling. */
const GONE_PID = 4_194_305;

for (const factory of storeFactories()) {
  describe(`unfinished imports on ${factory.kind}`, () => {
    const fixture = useMigratedStore(factory);

    it.each([
      ['its owner, this process, is importing', importOwner(), NOW - 1000, false],
      ['its owner on this host has died', `${hostname()}:${GONE_PID}`, NOW - 1000, true],
      ['another host made progress a minute ago', 'elsewhere:42', NOW - 60_000, false],
      ['another host has made no progress for too long', 'elsewhere:42', NOW - IMPORT_STALE_MS - 1, true],
      ['a finished batch', null, null, false],
    ])('when %s, the batch is removed: %s → %s', async (what, owner, heartbeat, removed) => {
      const name = `sweep: ${what}`;
      const { id } = await fixture.store.db.insertInto('batches').values({ name, source_hash: name, source_name: 'x', reviews_required: 1, blind_first: 1, consensus_rule: '{}', rubric_id: null, created_by: null, created_at: iso(NOW), import_owner: owner, import_heartbeat_at: heartbeat === null ? null : iso(heartbeat) }).returning('id').executeTakeFirstOrThrow();
      await fixture.store.db.insertInto('items').values({ batch_id: id, prompt_id: 'p', prompt: 'q', flag_reason: null, flag_severity: null, meta: null, state: 'staged', priority: 0, created_at: iso(NOW), score_bands: null, finding_checks: null }).execute();
      const swept = await sweepUnfinishedImports(fixture.store.db, NOW);
      expect(swept.includes(name)).toBe(removed);
      const left = await fixture.store.db.selectFrom('items').select('id').where('batch_id', '=', id).execute();
      expect(left.length).toBe(removed ? 0 : 1); // the batch's items go with it
    });
  });
}
