import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrate } from '../../src/store/migrate.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import { decidedItems, pairsOf, pseudonym, redact } from '../../src/io/export-decisions.ts';
import { openStore, type Store } from '../../src/store/connect.ts';
import { runCli } from '../helpers/cli.ts';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-export-'));
const db = join(dir, 'export.db');
let store: Store;

beforeAll(async () => {
  store = await openStore({ kind: 'sqlite', file: db });
  await migrate(store);
  await seedDemo(store.db, { password: () => 'pw-export-1' });
});
afterAll(() => store.close());

describe('export of final decisions', () => {
  it('writes every ordered pair: Σ K(K−1)/2 less ties, and the ties too when asked', async () => {
    const items = [];
    for await (const item of decidedItems(store.db, { format: 'pairs' })) items.push(item);
    const all = items.reduce((n, i) => n + (i.responses.length * (i.responses.length - 1)) / 2, 0);
    const ties = items.reduce((n, i) => {
      const ranks = Object.values(i.ranking);
      let t = 0;
      for (let a = 0; a < ranks.length; a++) for (let b = a + 1; b < ranks.length; b++) if (ranks[a] === ranks[b]) t++;
      return n + t;
    }, 0);
    expect(ties).toBeGreaterThan(0);
    const out = join(dir, 'pairs.jsonl');
    const result = runCli(['export', '--format', 'pairs', '--as', 'jsonl', '--out', out], { env: { PLUMBLINE_DB: db } });
    expect(result.code, result.stderr).toBe(0);
    const pairs = readFileSync(out, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(pairs).toHaveLength(all - ties);
    const withTies = join(dir, 'pairs-ties.jsonl');
    runCli(['export', '--format', 'pairs', '--as', 'jsonl', '--include-ties', '--out', withTies], { env: { PLUMBLINE_DB: db } });
    const tied = readFileSync(withTies, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(tied).toHaveLength(all);
    expect(tied.filter((p) => p.tie)).toHaveLength(ties);
  });

  it('carries every documented field, with consistent values', () => {
    const pairs = readFileSync(join(dir, 'pairs.jsonl'), 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(Object.keys(pairs[0])).toEqual(['batch', 'prompt_id', 'prompt', 'preferred_id', 'preferred_text', 'preferred_rank', 'other_id', 'other_text', 'other_rank', 'tie', 'decided_by', 'decided_at', 'reviewer_count', 'reviewer_ids', 'reviewer_agreement', 'rubric_id', 'rubric_version', 'rationale']);
    for (const p of pairs) {
      expect(p.preferred_rank).toBeLessThan(p.other_rank);
      expect(['consensus', 'adjudication']).toContain(p.decided_by);
      expect(p.reviewer_ids).toHaveLength(p.reviewer_count);
      for (const id of p.reviewer_ids) expect(id).toMatch(/^rv_[0-9a-f]{12}$/);
      expect(p.rubric_version).toMatch(/^[0-9a-f]{12}$/);
    }
    expect(JSON.stringify(pairs)).not.toMatch(/"reviewer"|"reviewer2"|Ines Calloway/);
  });

  it('writes the data card beside the export with counts, agreement, biases and cautions', () => {
    const card = readFileSync(join(dir, 'pairs.card.md'), 'utf8');
    expect(card).toMatch(/Decided items: 6 \(\d by reviewer consensus, \d by adjudication\)/);
    expect(card).toMatch(/Pairs: \d+ strictly ordered; tied pairs left out/);
    expect(card).toMatch(/Mean pairwise agreement between reviewers of the same item: \d+\.\d%/);
    expect(card).toMatch(/Length: the longer response is preferred in \d+\.\d% of \d+ pairs/);
    expect(card).toContain('may hold personal data');
    expect(card).toContain('harmful or unsafe text');
  });

  it('exports rankings as CSV, one row per response, quoting fields as RFC 4180 says', () => {
    const out = join(dir, 'rankings.csv');
    expect(runCli(['export', '--format', 'rankings', '--as', 'csv', '--batch', 'Cairnfield support — flagged week 48', '--out', out], { env: { PLUMBLINE_DB: db } }).code).toBe(0);
    const text = readFileSync(out, 'utf8');
    expect(text.split('\n')[0]).toBe('batch,prompt_id,prompt,response_id,text,rank,decided_by,decided_at,reviewer_count,reviewer_ids,reviewer_agreement,rubric_id,rubric_version,rationale');
    expect(text).toContain('"Bring the water to a rolling boil for 1 minute. Above about 2,000 metres, boil it for 3 minutes."');
  });

  it('redacts personal data when asked', () => {
    expect(redact('Write to kit@example.org or call +44 7700 900123.')).toBe('Write to [email removed] or call [phone removed].');
    const out = join(dir, 'redacted.jsonl');
    runCli(['export', '--format', 'rankings', '--as', 'jsonl', '--redact-pii', '--out', out], { env: { PLUMBLINE_DB: db } });
    const text = readFileSync(out, 'utf8');
    expect(text).not.toContain('4111 1111 1111 1111');
    expect(text).not.toContain('morwen.talbot@example.net');
    expect(text).toContain('[payment card removed]');
    expect(readFileSync(join(dir, 'redacted.card.md'), 'utf8')).toContain('was replaced by its kind');
  });

  it('pseudonymises reviewers stably under one salt and differently under another', () => {
    expect(pseudonym('salt-a', 7)).toBe(pseudonym('salt-a', 7));
    expect(pseudonym('salt-a', 7)).not.toBe(pseudonym('salt-b', 7));
    expect(pairsOf({ batch: 'b', promptId: 'p', prompt: 'q', responses: [{ responseId: 'x', text: 'X' }, { responseId: 'y', text: 'Y' }], ranking: { x: 2, y: 1 }, decidedBy: 'adjudication', decidedAt: 't', reviewers: [], agreement: null, rubric: { id: null, version: null }, rationale: null, reviewRationales: [] }, false)[0]).toMatchObject({ preferred_id: 'y', other_id: 'x' });
  });

  it('refuses an unknown batch and bad options with a clear line', () => {
    expect(runCli(['export', '--format', 'triples', '--out', join(dir, 'x')], { env: { PLUMBLINE_DB: db } }).stderr).toMatch(/--format must be pairs or rankings/);
    expect(runCli(['export', '--batch', 'nope', '--out', join(dir, 'x')], { env: { PLUMBLINE_DB: db } }).stderr).toMatch(/there is no batch "nope"/);
  });
});
