import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.ts';

const db = join(mkdtempSync(join(tmpdir(), 'plumbline-users-')), 'users.db');
const env = { PLUMBLINE_DB: db };

describe('plumbline user', () => {
  it('adds, lists, disables and resets users, printing each password once', () => {
    const added = runCli(['user', 'add', 'rowan', '--roles', 'reviewer,adjudicator', '--display-name', 'Rowan Ede'], { env });
    expect(added.code, added.stderr).toBe(0);
    expect(added.stdout).toMatch(/^added rowan \(reviewer, adjudicator\); password: [a-z0-9]{4}-[a-z0-9]{4}-[a-z0-9]{4}-[a-z0-9]{4}$/m);
    expect(runCli(['user', 'list'], { env }).stdout).toMatch(/^rowan\s+active\s+reviewer,adjudicator\s+Rowan Ede$/m);
    expect(runCli(['user', 'disable', 'rowan'], { env }).stdout).toContain('disabled rowan');
    expect(runCli(['user', 'list'], { env }).stdout).toMatch(/^rowan\s+disabled/m);
    const reset = runCli(['user', 'reset-password', 'rowan'], { env });
    expect(reset.stdout).toMatch(/^new password for rowan: \S+$/m);
    expect(runCli(['user', 'list'], { env }).stdout).toMatch(/^rowan\s+active/m);
  });
  const errors: [string[], number, RegExp][] = [
    [['user', 'add', 'rowan', '--roles', 'reviewer'], 1, /a user named "rowan" already exists/],
    [['user', 'add', 'kit', '--roles', 'reviewer,wizard'], 1, /unknown role wizard — roles are reviewer, adjudicator, policy, data, admin/],
    [['user', 'add', 'Bad Name', '--roles', 'reviewer'], 1, /must be 2–40 lower-case letters/],
    [['user', 'add', 'kit'], 2, /give --roles/],
    [['user', 'disable', 'ghost'], 1, /there is no user "ghost"/],
  ];
  for (const [args, code, message] of errors) {
    it(`exits ${code} for: plumbline ${args.join(' ')}`, () => {
      const result = runCli(args, { env });
      expect(result.code).toBe(code);
      expect(result.stderr).toMatch(message);
    });
  }
});
