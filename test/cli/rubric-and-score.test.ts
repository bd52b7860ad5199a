import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.ts';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-score-'));
const jsonl = join(dir, 'batch.jsonl');
writeFileSync(jsonl, [
  JSON.stringify({ prompt_id: 'p1', prompt: 'Which card did I pay with?', responses: [{ response_id: 'a', text: 'Card 4111 1111 1111 1111.' }, { response_id: 'b', text: 'The card ending in 1111.' }] }),
  JSON.stringify({ prompt_id: 'p2', prompt: 'How long should I boil water?', responses: [{ response_id: 'a', text: 'Boil it for 1 minute.' }, { response_id: 'b', text: 'Boil it for 10 minutes.' }, { response_id: 'c', text: 'One minute at a rolling boil.' }], flag: { reason: 'health', severity: 'medium' } }),
].join('\n'));
const csv = join(dir, 'batch.csv');
writeFileSync(csv, 'prompt_id,prompt,response_id,response\np1,"Which card, exactly?",a,"Card 4111 1111 1111 1111."\np1,"Which card, exactly?",b,"The one ending in 1111, as shown on the ""Orders"" page."\n');

describe('plumbline score', () => {
  it('writes one JSON line per response with the documented fields', () => {
    const out = join(dir, 'scored.jsonl');
    const result = runCli(['score', jsonl, '--out', out]);
    expect(result.code).toBe(0);
    const lines = readFileSync(out, 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toHaveLength(5);
    expect(Object.keys(lines[0])).toEqual(['prompt_id', 'response_id', 'rubric', 'score', 'band', 'suggested_rank', 'criteria', 'findings', 'priority']);
    expect(lines[0]).toMatchObject({ prompt_id: 'p1', response_id: 'a', rubric: { id: 'general' }, band: 'fail', suggested_rank: 2 });
    expect(lines[0].findings[0]).toMatchObject({ criterion: 'no-personal-data', check: 'personal-data', severity: 'critical', evidence: '4111 1111 1111 1111' });
    expect(Object.keys(lines[0].criteria['no-personal-data'])).toEqual(['value', 'band', 'metrics']);
    expect(lines[0].priority.critical).toBe(true);
    expect(lines[3]).toMatchObject({ prompt_id: 'p2', response_id: 'b' });
    expect(lines[3].findings.some((f: { check: string }) => f.check === 'consistency')).toBe(true);
  });

  it('reads CSV with quoted commas and quotes', () => {
    const result = runCli(['score', csv, '--rubric', 'rubrics/cairnfield-support.yaml'], { cwd: new URL('../../', import.meta.url).pathname });
    expect(result.code).toBe(0);
    const lines = result.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.map((l) => l.response_id)).toEqual(['a', 'b']);
    expect(lines[0].rubric.id).toBe('cairnfield-support');
  });

  it('reports every bad line and writes nothing', () => {
    const bad = join(dir, 'bad.jsonl');
    writeFileSync(bad, [
      JSON.stringify({ prompt_id: 'p1', prompt: 'x', responses: [{ response_id: 'a', text: 'only one' }] }),
      '{"prompt_id": "p2", "prompt": ',
      JSON.stringify({ prompt_id: 'p3', prompt: 'x', responses: [{ response_id: 'a', text: '1' }, { response_id: 'a', text: '2' }] }),
    ].join('\n'));
    const out = join(dir, 'never.jsonl');
    const result = runCli(['score', bad, '--out', out]);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`${bad}:1: responses: has 1 response; a prompt needs 2 to 9 to rank`);
    expect(result.stderr).toMatch(new RegExp(`${bad}:2: is not valid JSON`));
    expect(result.stderr).toContain(`${bad}:3: responses[2].response_id: "a" is used twice in this prompt`);
    expect(result.stderr).toContain('nothing was scored');
    expect(existsSync(out)).toBe(false);
  });

  it('refuses a broken rubric with its problems', () => {
    const broken = join(dir, 'broken.yaml');
    writeFileSync(broken, 'id: x\ntitle: X\ncriteria:\n  - id: a\n    check: repitition\n');
    const result = runCli(['score', jsonl, '--rubric', broken]);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`${broken}:5:12: unknown check "repitition"`);
  });
});

describe('plumbline rubric check and rubric test', () => {
  it('pass on the shipped rubrics', () => {
    const cwd = new URL('../../', import.meta.url).pathname;
    const check = runCli(['rubric', 'check', 'rubrics/general.yaml', 'rubrics/cairnfield-support.yaml', 'rubrics/young-readers.yaml'], { cwd });
    expect(check.code).toBe(0);
    expect(check.stdout).toMatch(/general\.yaml: ok/);
    const test = runCli(['rubric', 'test', 'rubrics/general.yaml', 'rubrics/cairnfield-support.yaml', 'rubrics/young-readers.yaml'], { cwd });
    expect(test.code).toBe(0);
    expect(test.stdout).toMatch(/^\d+ passed, 0 failed$/m);
  });
  it('exit 1 and list problems for a broken file; a failing example fails rubric test', () => {
    const broken = join(dir, 'b.yaml');
    writeFileSync(broken, 'id: x\ntitle: X\ncriterias: []\ncriteria:\n  - id: a\n    check: format\n');
    const check = runCli(['rubric', 'check', broken]);
    expect(check.code).toBe(1);
    expect(check.stdout.trim()).toBe(`${broken}:3:1: unknown key "criterias" in rubric — did you mean "criteria"?`);
    const failing = join(dir, 'f.yaml');
    writeFileSync(failing, 'id: x\ntitle: X\ncriteria:\n  - id: a\n    check: format\nexamples:\n  - name: wrong on purpose\n    prompt: p\n    response: A fine sentence.\n    expect: { a: fail }\n');
    const test = runCli(['rubric', 'test', failing]);
    expect(test.code).toBe(1);
    expect(test.stdout).toContain('✗ wrong on purpose');
    expect(test.stdout).toContain('a: expected fail, got pass');
    expect(test.stdout).toMatch(/^0 passed, 1 failed$/m);
  });
});

describe('plumbline rubric diff', () => {
  it('re-scores a stored batch with the old and new rubric and reports the changes', async () => {
    const { openStore } = await import('../../src/store/connect.ts');
    const { migrate } = await import('../../src/store/migrate.ts');
    const { seedDemo, DEMO_BATCH_NAME } = await import('../../src/demo/seed.ts');
    const db = join(dir, 'diff.db');
    const store = await openStore({ kind: 'sqlite', file: db });
    await migrate(store);
    await seedDemo(store.db, { password: () => 'pw-diff-123' });
    await store.close();
    const root = new URL('../../', import.meta.url).pathname;
    const draft = join(dir, 'draft.yaml');
    writeFileSync(draft, readFileSync(join(root, 'rubrics/cairnfield-support.yaml'), 'utf8').replace('overall_bands: { pass: 80, review: 55 }', 'overall_bands: { pass: 95, review: 55 }'));
    const result = runCli(['rubric', 'diff', 'rubrics/cairnfield-support.yaml', draft, '--batch', DEMO_BATCH_NAME], { cwd: root, env: { PLUMBLINE_DB: db } });
    expect(result.code, result.stderr).toBe(0);
    expect(result.stdout).toContain(`${DEMO_BATCH_NAME}: 40 items, 175 responses re-scored`);
    expect(result.stdout).toMatch(/^\d+ candidates change band$/m);
    expect(result.stdout).toMatch(/: pass → review \(/);
    const missing = runCli(['rubric', 'diff', 'rubrics/cairnfield-support.yaml', draft, '--batch', 'nope'], { cwd: root, env: { PLUMBLINE_DB: db } });
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain('there is no batch "nope"');
  });
});

describe('plumbline import', () => {
  it('stores a batch scored with the rubric, then refuses the same file again', () => {
    const db = join(dir, 'import.db');
    const first = runCli(['import', jsonl, '--batch', 'cli batch', '--reviews', '2'], { env: { PLUMBLINE_DB: db } });
    expect(first.code, first.stderr).toBe(0);
    expect(first.stdout).toMatch(/^imported "cli batch": 2 prompts, 5 responses, scored with general [0-9a-f]{12}$/m);
    const again = runCli(['import', jsonl, '--batch', 'other name'], { env: { PLUMBLINE_DB: db } });
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('was already imported as batch "cli batch"');
  });
  it('lists every bad line and stores nothing', () => {
    const db = join(dir, 'import-bad.db');
    const bad = join(dir, 'import-bad.jsonl');
    writeFileSync(bad, '{"prompt_id": "p", "prompt": "q", "responses": []}\nnot json\n');
    const result = runCli(['import', bad, '--batch', 'x'], { env: { PLUMBLINE_DB: db } });
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`${bad}:1: responses: has 0 responses`);
    expect(result.stderr).toContain(`${bad}:2: is not valid JSON`);
    expect(result.stderr).toMatch(/2 problem\(s\) — nothing was imported/);
  });
  it('needs a batch name', () => {
    const result = runCli(['import', jsonl]);
    expect(result.code).toBe(2);
    expect(result.stderr.trim()).toBe('plumbline: import: name the batch with --batch NAME');
  });
});

describe('score progress', () => {
  it('reports progress on stderr, a line every tenth when not on a terminal, for inputs over 1,000 responses', () => {
    const big = join(dir, 'big.jsonl');
    writeFileSync(big, Array.from({ length: 205 }, (_, i) => JSON.stringify({ prompt_id: `b${i}`, prompt: 'How long should I boil water?', responses: 'abcde'.split('').map((id) => ({ response_id: id, text: `Boil it for ${i % 9 + 1} minutes.` })) })).join('\n'));
    const out = join(dir, 'big-scored.jsonl');
    const result = runCli(['score', big, '--out', out]);
    expect(result.code).toBe(0);
    const lines = result.stderr.split('\n').filter((l) => l.startsWith('scoring:'));
    expect(lines).toHaveLength(10);
    expect(lines[0]).toMatch(/^scoring: \d+ of 1025 responses \(10%\)$/);
    expect(lines.at(-1)).toBe('scoring: 1025 of 1025 responses (100%)');
    expect(readFileSync(out, 'utf8').trim().split('\n')).toHaveLength(1025);
  }, 120_000);
});
