import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { importBatch, ImportRefused } from '../../src/io/import-batch.ts';
import { loadRubricFile } from '../../src/rubric/load.ts';
import { storeFactories, useMigratedStore } from '../helpers/stores.ts';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-import-'));
const rubric = loadRubricFile(new URL('../../rubrics/general.yaml', import.meta.url).pathname).rubric!;
const TABLES = ['batches', 'items', 'responses', 'scores', 'rubric_versions', 'audit_events'] as const;

const r = (id: string, text = `Answer ${id}.`) => ({ response_id: id, text });
const line = (o: unknown) => JSON.stringify(o);
const good = (id: string) => line({ prompt_id: id, prompt: `Question ${id}?`, responses: [r('a'), r('b')] });

/** Every kind of bad line: the file, the line and field reported, and the reason. */
const badFiles: { kind: string; name: string; content: string | Buffer; line: number; field: string | null; reason: RegExp }[] = [
  { kind: 'not JSON', name: 'a.jsonl', content: `${good('p1')}\n{"prompt_id": "p2",`, line: 2, field: null, reason: /is not valid JSON/ },
  { kind: 'a JSON array instead of an object', name: 'a.jsonl', content: '[1, 2]', line: 1, field: null, reason: /must be a JSON object/ },
  { kind: 'missing prompt_id', name: 'a.jsonl', content: line({ prompt: 'q', responses: [r('a'), r('b')] }), line: 1, field: 'prompt_id', reason: /is missing/ },
  { kind: 'prompt_id of the wrong type', name: 'a.jsonl', content: line({ prompt_id: { x: 1 }, prompt: 'q', responses: [r('a'), r('b')] }), line: 1, field: 'prompt_id', reason: /must be text/ },
  { kind: 'empty prompt_id', name: 'a.jsonl', content: line({ prompt_id: ' ', prompt: 'q', responses: [r('a'), r('b')] }), line: 1, field: 'prompt_id', reason: /is empty/ },
  { kind: 'missing prompt', name: 'a.jsonl', content: line({ prompt_id: 'p', responses: [r('a'), r('b')] }), line: 1, field: 'prompt', reason: /is missing/ },
  { kind: 'prompt not text', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 42, responses: [r('a'), r('b')] }), line: 1, field: 'prompt', reason: /must be text/ },
  { kind: 'empty prompt', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: '', responses: [r('a'), r('b')] }), line: 1, field: 'prompt', reason: /is empty/ },
  { kind: 'missing responses', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q' }), line: 1, field: 'responses', reason: /is missing/ },
  { kind: 'responses not a list', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: 'a, b' }), line: 1, field: 'responses', reason: /must be a list/ },
  { kind: 'too few responses', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a')] }), line: 1, field: 'responses', reason: /has 1 response; a prompt needs 2 to 9/ },
  { kind: 'too many responses', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: 'abcdefghij'.split('').map((id) => r(id)) }), line: 1, field: 'responses', reason: /has 10 responses; at most 9/ },
  { kind: 'response without response_id', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [{ text: 'x' }, r('b')] }), line: 1, field: 'responses[1].response_id', reason: /is missing/ },
  { kind: 'response without text', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), { response_id: 'b' }] }), line: 1, field: 'responses[2].text', reason: /is missing/ },
  { kind: 'response text not text', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), { response_id: 'b', text: 7 }] }), line: 1, field: 'responses[2].text', reason: /must be text/ },
  { kind: 'empty response_id', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r(''), r('b')] }), line: 1, field: 'responses[1].response_id', reason: /is empty/ },
  { kind: 'duplicate response ids', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), r('a')] }), line: 1, field: 'responses[2].response_id', reason: /used twice in this prompt/ },
  { kind: 'duplicate prompt ids', name: 'a.jsonl', content: `${good('p1')}\n${good('p2')}\n${good('p1')}`, line: 3, field: 'prompt_id', reason: /already used on line 1/ },
  { kind: 'unknown field', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), r('b')], answers: [] }), line: 1, field: 'answers', reason: /is not a field of the import format/ },
  { kind: 'flag with an unknown severity', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), r('b')], flag: { reason: 'x', severity: 'severe' } }), line: 1, field: 'flag.severity', reason: /"severe" is not a severity/ },
  { kind: 'flag not an object', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), r('b')], flag: 'high' }), line: 1, field: 'flag', reason: /must be \{"reason"/ },
  { kind: 'meta not an object', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a'), r('b')], meta: [1] }), line: 1, field: 'meta', reason: /must be an object/ },
  { kind: 'text over the size limit', name: 'a.jsonl', content: line({ prompt_id: 'p', prompt: 'q', responses: [r('a', 'x'.repeat(100_001)), r('b')] }), line: 1, field: 'responses[1].text', reason: /is 100001 bytes, over the limit of 100000/ },
  { kind: 'invalid UTF-8', name: 'a.jsonl', content: Buffer.concat([Buffer.from(`${good('p1')}\n{"prompt_id": "p2", "prompt": "caf`), Buffer.from([0xc3, 0x28]), Buffer.from('", "responses": []}\n')]), line: 2, field: null, reason: /is not valid UTF-8/ },
  { kind: 'CSV header lacking a column', name: 'a.csv', content: 'prompt_id,prompt,response\np,q,x\n', line: 1, field: 'header', reason: /lacks the column response_id/ },
  { kind: 'CSV header with an unknown column', name: 'a.csv', content: 'prompt_id,prompt,response_id,response,score\np,q,a,x,1\n', line: 1, field: 'header', reason: /has unknown column score/ },
  { kind: 'CSV row with the wrong number of fields', name: 'a.csv', content: 'prompt_id,prompt,response_id,response\np,q,a,x\np,q,b,x,extra\n', line: 3, field: null, reason: /has 5 fields; the header has 4/ },
  { kind: 'CSV quote never closed', name: 'a.csv', content: 'prompt_id,prompt,response_id,response\np,q,a,x\np,q,b,"never closed\n', line: 3, field: null, reason: /never closed/ },
  { kind: 'CSV prompt text differing between rows', name: 'a.csv', content: 'prompt_id,prompt,response_id,response\np,q,a,x\np,Q!,b,y\n', line: 3, field: 'prompt', reason: /differs from the prompt given for "p" on line 2/ },
  { kind: 'CSV prompt rows split apart', name: 'a.csv', content: 'prompt_id,prompt,response_id,response\np,q,a,x\np,q,b,y\nr,s,a,x\nr,s,b,y\np,q,c,z\n', line: 6, field: 'prompt_id', reason: /appears again after other prompts/ },
  { kind: 'CSV empty file', name: 'a.csv', content: '', line: 1, field: 'header', reason: /the file is empty/ },
];

for (const factory of storeFactories()) {
  describe(`import on ${factory.kind}`, () => {
    const fixture = useMigratedStore(factory);
    const counts = async () => Object.fromEntries(await Promise.all(TABLES.map(async (t) => [t, Number((await fixture.store.db.selectFrom(t).select(sql<number>`count(*)`.as('n')).executeTakeFirstOrThrow()).n)])));

    it(`refuses ${badFiles.length} kinds of bad line, each with its line, field and reason, storing nothing`, async () => {
      const before = await counts();
      for (const [i, bad] of badFiles.entries()) {
        const path = join(dir, `${factory.kind}-${i}-${bad.name}`);
        writeFileSync(path, bad.content);
        const error = await importBatch(fixture.store, { path, batchName: `bad ${i}`, rubric }).catch((e) => e);
        expect(error, bad.kind).toBeInstanceOf(ImportRefused);
        const hit = (error as ImportRefused).problems.find((p) => bad.reason.test(p.message));
        expect(hit, `${bad.kind}: ${JSON.stringify((error as ImportRefused).problems)}`).toBeDefined();
        expect([hit!.line, hit!.field], bad.kind).toEqual([bad.line, bad.field]);
        expect(await counts(), bad.kind).toEqual(before);
      }
      expect(badFiles.length).toBeGreaterThanOrEqual(25);
    });

    it('stores a good file whole, scored, and refuses the same file twice', async () => {
      const path = join(dir, `${factory.kind}-good.jsonl`);
      writeFileSync(path, [good('p1'), good('p2'), line({ prompt_id: 'p3', prompt: 'Which card?', responses: [r('a', 'Card 4111 1111 1111 1111.'), r('b')], flag: { reason: 'pii', severity: 'high' }, meta: { channel: 'chat' } })].join('\n'));
      const result = await importBatch(fixture.store, { path, batchName: `good ${factory.kind}`, rubric, reviews: 2 });
      expect(result).toMatchObject({ items: 3, responses: 6, rejected: 0 });
      const batch = await fixture.store.db.selectFrom('batches').selectAll().where('id', '=', result.batchId).executeTakeFirstOrThrow();
      expect(batch).toMatchObject({ reviews_required: 2, rubric_id: 'general' });
      const items = await fixture.store.db.selectFrom('items').selectAll().where('batch_id', '=', result.batchId).orderBy('priority', 'desc').execute();
      expect(items[0].prompt_id).toBe('p3'); // a critical finding comes first
      expect(JSON.parse(items[0].meta!)).toEqual({ channel: 'chat' });
      const scores = await fixture.store.db.selectFrom('scores').select(['rubric_version']).where('rubric_id', '=', 'general').execute();
      expect(scores.length).toBeGreaterThanOrEqual(6);
      expect(new Set(scores.map((s) => s.rubric_version))).toEqual(new Set([rubric.version]));
      const before = await counts();
      await expect(importBatch(fixture.store, { path, batchName: 'again', rubric })).rejects.toThrow(/already imported as batch "good/);
      expect(await counts()).toEqual(before);
    });

    it('with a rejects file, stores the good lines and lists the bad ones', async () => {
      const path = join(dir, `${factory.kind}-mixed.jsonl`);
      const rejects = join(dir, `${factory.kind}-rejects.jsonl`);
      writeFileSync(path, [good('m1'), 'not json', good('m2'), line({ prompt_id: 'm3', prompt: 'q', responses: [r('a')] })].join('\n'));
      const result = await importBatch(fixture.store, { path, batchName: `mixed ${factory.kind}`, rubric, rejectsPath: rejects });
      expect(result).toMatchObject({ items: 2, rejected: 2 });
      const listed = readFileSync(rejects, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
      expect(listed.map((p) => p.line)).toEqual([2, 4]);
    });

    it('stores the same scores, in file order, whether scored on worker threads or on the calling thread', async () => {
      const lines = Array.from({ length: 60 }, (_, i) => line({ prompt_id: `t${i}`, prompt: `How long should stream water boil, case ${i}?`, responses: [r('a', `Boil it for ${i % 5 + 1} minutes. Never drink it straight from the stream.`), r('b', 'I cannot help with that.')] }));
      const stored = async (threads: number) => {
        const path = join(dir, `${factory.kind}-threads-${threads}.jsonl`);
        writeFileSync(path, `${lines.join('\n')}\n${threads ? '' : '\n'}`); // different bytes, so not refused as a repeat
        const { batchId } = await importBatch(fixture.store, { path, batchName: `threads ${threads} ${factory.kind}`, rubric, scoreThreads: threads });
        return fixture.store.db
          .selectFrom('scores')
          .innerJoin('responses', 'responses.id', 'scores.response_id')
          .innerJoin('items', 'items.id', 'responses.item_id')
          .select(['items.prompt_id', 'responses.response_id', 'scores.overall', 'scores.band', 'scores.suggested_rank', 'scores.criteria', 'scores.findings', 'items.priority'])
          .where('items.batch_id', '=', batchId)
          .orderBy('items.id')
          .orderBy('responses.id')
          .execute();
      };
      const onWorkers = await stored(2);
      const inline = await stored(0);
      expect(onWorkers).toHaveLength(120);
      expect(onWorkers.map((s) => s.prompt_id).slice(0, 3)).toEqual(['t0', 't0', 't1']);
      expect(onWorkers).toEqual(inline);
    });

    it('refuses a batch name already in use', async () => {
      const path = join(dir, `${factory.kind}-other.jsonl`);
      writeFileSync(path, [good('o1'), good('o2')].join('\n'));
      await expect(importBatch(fixture.store, { path, batchName: `good ${factory.kind}`, rubric })).rejects.toThrow(/a batch named "good .*" already exists/);
    });
  });
}
