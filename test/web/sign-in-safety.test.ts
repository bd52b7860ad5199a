import { describe, expect, it } from 'vitest';
import { ORIGIN, cookiesFrom, csrfFrom, demoPassword, useSeededApp, signIn } from '../helpers/web.ts';
import { ABSOLUTE_TIMEOUT_MS, IDLE_TIMEOUT_MS } from '../../src/web/middleware/session.ts';
import { MAX_FAILURES_PER_ACCOUNT, MAX_FAILURES_PER_ADDRESS } from '../../src/auth/throttle.ts';

const fixture = useSeededApp();

async function attempt(username: string, password: string) {
  const page = await fixture.app.request('/login');
  const cookie = cookiesFrom(page);
  return fixture.app.request('/login', {
    method: 'POST',
    headers: { cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ username, password, _csrf: csrfFrom(await page.text()) }),
  });
}

describe('sign-in throttling', () => {
  it(`pauses an account after ${MAX_FAILURES_PER_ACCOUNT} failures, even for the right password, with a clear message`, async () => {
    for (let i = 0; i < MAX_FAILURES_PER_ACCOUNT; i++) expect((await attempt('reviewer2', 'wrong')).status).toBe(401);
    const paused = await attempt('reviewer2', demoPassword('reviewer2'));
    expect(paused.status).toBe(429);
    expect(await paused.text()).toMatch(/Too many failed sign-ins for this account\. Wait about 15 minutes/);
    // other accounts still sign in
    expect((await attempt('reviewer', demoPassword('reviewer'))).status).toBe(303);
    // the pause ends when the failures age out of the window
    await fixture.store.db.updateTable('login_failures').set({ at: new Date(Date.now() - 16 * 60 * 1000).toISOString() }).execute();
    expect((await attempt('reviewer2', demoPassword('reviewer2'))).status).toBe(303);
  });

  it(`pauses an address after ${MAX_FAILURES_PER_ADDRESS} failures across accounts`, async () => {
    await fixture.store.db.deleteFrom('login_failures').execute();
    for (let i = 0; i < MAX_FAILURES_PER_ADDRESS; i++) await attempt(`nobody${i}`, 'x');
    const paused = await attempt('adjudicator', demoPassword('adjudicator'));
    expect(paused.status).toBe(429);
    expect(await paused.text()).toContain('for your network address');
    await fixture.store.db.deleteFrom('login_failures').execute();
  });

  it('refuses a disabled account', async () => {
    await fixture.store.db.updateTable('users').set({ disabled: 1 }).where('username', '=', 'data').execute();
    expect((await attempt('data', demoPassword('data'))).status).toBe(401);
    await fixture.store.db.updateTable('users').set({ disabled: 0 }).where('username', '=', 'data').execute();
  });
});

describe('session timeouts', () => {
  const cases: [string, Partial<{ last_seen_at: string; created_at: string }>][] = [
    ['idle longer than the idle timeout', { last_seen_at: new Date(Date.now() - IDLE_TIMEOUT_MS - 60_000).toISOString() }],
    ['older than the absolute timeout, however active', { created_at: new Date(Date.now() - ABSOLUTE_TIMEOUT_MS - 60_000).toISOString(), last_seen_at: new Date().toISOString() }],
  ];
  for (const [name, change] of cases) {
    it(`ends a session ${name}`, async () => {
      const { cookie } = await signIn(fixture.app, 'policy');
      expect((await fixture.app.request('/rubrics', { headers: { cookie } })).status).toBe(200);
      const before = await fixture.store.db.selectFrom('sessions').select('id').execute();
      await fixture.store.db.updateTable('sessions').set(change).execute();
      const res = await fixture.app.request('/rubrics', { headers: { cookie } });
      expect(res.status).toBe(303);
      expect(res.headers.get('location')).toBe('/login?next=%2Frubrics');
      expect((await fixture.store.db.selectFrom('sessions').select('id').execute()).length).toBeLessThan(before.length);
    });
  }
});
