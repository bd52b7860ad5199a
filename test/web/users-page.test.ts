import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqliteFactory } from '../helpers/stores.ts';
import { ORIGIN, cookiesFrom, csrfFrom, seededApp, signIn } from '../helpers/web.ts';
import { findUserByName } from '../../src/store/repos/users.ts';
import type { Store } from '../../src/store/connect.ts';

const factory = sqliteFactory();
let store: Store;
let app: Awaited<ReturnType<typeof seededApp>>;
let admin: { cookie: string; csrf: string };

beforeAll(async () => {
  store = await factory.open();
  app = await seededApp(store);
  admin = await signIn(app, 'admin');
});
afterAll(async () => {
  await store.close();
  await factory.cleanup();
});

const post = (path: string, body: URLSearchParams) => {
  body.set('_csrf', admin.csrf);
  return app.request(path, { method: 'POST', headers: { cookie: admin.cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body });
};

async function canSignIn(username: string, password: string): Promise<boolean> {
  const page = await app.request('/login');
  const res = await app.request('/login', { method: 'POST', headers: { cookie: cookiesFrom(page), origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams({ username, password, _csrf: csrfFrom(await page.text()) }) });
  return res.status === 303;
}

describe('users admin page', () => {
  it('adds a user with roles and shows the password once; the user can sign in', async () => {
    const body = new URLSearchParams({ username: 'wren', display_name: 'Wren Ashby' });
    body.append('roles', 'reviewer');
    body.append('roles', 'adjudicator');
    const res = await post('/admin/users', body);
    expect(res.status).toBe(201);
    const password = (await res.text()).match(/<code class="token">([^<]+)<\/code>/)![1];
    expect((await findUserByName(store.db, 'wren'))?.roles).toBe('reviewer,adjudicator');
    expect(await canSignIn('wren', password)).toBe(true);
  });

  it('refuses a bad name, no roles, or a name in use', async () => {
    expect((await post('/admin/users', new URLSearchParams({ username: 'Bad Name', roles: 'reviewer' }))).status).toBe(422);
    expect(await (await post('/admin/users', new URLSearchParams({ username: 'norole' }))).text()).toContain('at least one role');
    expect(await (await post('/admin/users', new URLSearchParams({ username: 'reviewer', roles: 'reviewer' }))).text()).toContain('already exists');
  });

  it('disables a user (ending their sessions) and resets a password', async () => {
    const reviewer2 = await signIn(app, 'reviewer2');
    const target = (await findUserByName(store.db, 'reviewer2'))!;
    expect((await post(`/admin/users/${target.id}/disable`, new URLSearchParams())).status).toBe(303);
    expect((await app.request('/', { headers: { cookie: reviewer2.cookie } })).status).toBe(303);
    const reset = await post(`/admin/users/${target.id}/reset-password`, new URLSearchParams());
    const password = (await reset.text()).match(/<code class="token">([^<]+)<\/code>/)![1];
    expect(await canSignIn('reviewer2', password)).toBe(true);
    const audit = await store.db.selectFrom('audit_events').select('kind').where('kind', 'in', ['user_add', 'user_disable', 'user_reset_password']).execute();
    expect(audit.map((a) => a.kind).sort()).toEqual(['user_add', 'user_disable', 'user_reset_password']);
  });

  it('does not let an admin disable their own account', async () => {
    const me = (await findUserByName(store.db, 'admin'))!;
    expect((await post(`/admin/users/${me.id}/disable`, new URLSearchParams())).status).toBe(422);
  });
});
