import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../src/web/app.tsx';
import { sqliteFactory } from './stores.ts';
import { seedDemo } from '../../src/demo/seed.ts';
import { migrate } from '../../src/store/migrate.ts';
import type { Store } from '../../src/store/connect.ts';

export const ORIGIN = 'http://localhost';

/** The fixed demo password tests use for `username`. */
export const demoPassword = (username: string) => `test-${username}-pw`;

/** A migrated, demo-seeded store and an app over it. */
export async function seededApp(store: Store) {
  await migrate(store);
  await seedDemo(store.db, { password: demoPassword });
  return createApp({ store });
}

type App = ReturnType<typeof createApp>;

/** Reads the cookies a response sets, as a Cookie header value. */
export function cookiesFrom(res: Response, previous = ''): string {
  const jar = new Map(previous.split('; ').filter(Boolean).map((kv) => kv.split(/=(.*)/s, 2) as [string, string]));
  for (const line of res.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const [name, value] = pair.split(/=(.*)/s, 2);
    if (/max-age=0/i.test(line) || value === '') jar.delete(name);
    else jar.set(name, value);
  }
  return [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
}

export function csrfFrom(html: string): string {
  const match = html.match(/name="csrf-token" content="([^"]+)"/);
  if (!match) throw new Error('page has no csrf-token meta');
  return match[1];
}

/** Signs in through the login form like a browser and returns the session cookie and CSRF token. */
export async function signIn(app: App, username: string): Promise<{ cookie: string; csrf: string }> {
  const loginPage = await app.request('/login');
  let cookie = cookiesFrom(loginPage);
  const csrf = csrfFrom(await loginPage.text());
  const res = await app.request('/login', {
    method: 'POST',
    headers: { cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ username, password: demoPassword(username), _csrf: csrf, next: '/' }),
  });
  if (res.status !== 303) throw new Error(`sign-in as ${username} failed with ${res.status}`);
  cookie = cookiesFrom(res, cookie);
  const home = await app.request('/', { headers: { cookie } });
  return { cookie, csrf: csrfFrom(await home.text()) };
}

/**
 * A migrated, demo-seeded SQLite store and an app over it for one test file, opened before its
 * tests and removed after them. Read `fixture.store` and `fixture.app` inside tests.
 */
export function useSeededApp(): { store: Store; app: App } {
  const factory = sqliteFactory();
  const fixture = {} as { store: Store; app: App };
  beforeAll(async () => {
    fixture.store = await factory.open();
    fixture.app = await seededApp(fixture.store);
  });
  afterAll(async () => {
    await fixture.store.close();
    await factory.cleanup();
  });
  return fixture;
}
