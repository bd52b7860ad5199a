import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli, startServe, stop } from '../helpers/cli.ts';

describe('npm start (plumbline serve) on a fresh folder', () => {
  it('creates, migrates and seeds ./data/plumbline.db, serves the demo queue within 10 s, and does not re-seed on a second start', async () => {
    const cwd = mkdtempSync(join(tmpdir(), 'plumbline-start-'));
    const first = await startServe({ cwd });
    let password = '';
    try {
      expect(first.output()).toContain(`database: ${join(cwd, 'data/plumbline.db')}`);
      const login = first.output().match(/^\s+reviewer\s+(\S+)\s+reviewer$/m);
      expect(login, first.output()).not.toBeNull();
      password = login![1];
      // sign in and read the home page
      const page = await fetch(`${first.url}/login`);
      const cookie = page.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      const csrf = (await page.text()).match(/name="_csrf" value="([^"]+)"/)![1];
      const res = await fetch(`${first.url}/login`, {
        method: 'POST',
        redirect: 'manual',
        headers: { cookie, origin: first.url, 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ username: 'reviewer', password, _csrf: csrf, next: '/' }),
      });
      expect(res.status).toBe(303);
      const session = res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      const home = await fetch(`${first.url}/`, { headers: { cookie: session } });
      const html = await home.text();
      expect(html).toContain('Review queue');
      expect(html).toContain('cf-0');
      expect(first.startedInMs).toBeLessThan(10_000);
    } finally {
      expect(await stop(first.child)).toBe(0);
    }
    expect(first.output()).toContain('Stopping…');

    const second = await startServe({ cwd });
    try {
      expect(second.output()).not.toContain('Demo data loaded');
    } finally {
      await stop(second.child);
    }
    const status = runCli(['db', 'status'], { cwd });
    expect(status.stdout).toMatch(/applied\s+0003-login-failures/);
    expect(status.stdout).toContain('Up to date.');
  });
});
