import { describe, expect, it } from 'vitest';
import { storeBatch } from '../../src/store/repos/batches.ts';
import { ORIGIN, cookiesFrom, csrfFrom, demoPassword, useSeededApp, signIn } from '../helpers/web.ts';
import { CONTENT_SECURITY_POLICY } from '../../src/web/middleware/security-headers.ts';

const fixture = useSeededApp();

describe('sign-in, home queue and headers', () => {
  it('sends a visitor who is not signed in to the login page', async () => {
    const res = await fixture.app.request('/');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/login?next=%2F');
  });

  it('serves every page with the strict CSP and no inline script', async () => {
    const res = await fixture.app.request('/login');
    expect(res.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    const html = await res.text();
    expect(html.startsWith('<!doctype html>')).toBe(true);
    expect(html).not.toMatch(/<script(?![^>]*\bsrc=)[^>]*>/);
    expect(html).not.toMatch(/\son[a-z]+=/i);
    expect(html).not.toMatch(/style="/);
  });

  // Set before the route runs (see security-headers.ts); every kind of response must still carry them.
  it.each([
    { kind: 'a page', path: '/login', signedIn: false, status: 200, cache: 'no-store' },
    { kind: 'a redirect', path: '/', signedIn: false, status: 303, cache: 'no-store' },
    { kind: 'a static file with its own caching', path: '/static/plumbline.css', signedIn: false, status: 200, cache: 'public, max-age=3600' },
    { kind: 'a page that does not exist', path: '/no-such-page', signedIn: true, status: 404, cache: 'no-store' },
    { kind: 'an error thrown by a route', path: '/?band=nonsense', signedIn: true, status: 400, cache: 'no-store' },
    { kind: 'the queue page', path: '/', signedIn: true, status: 200, cache: 'no-store' },
  ])('sends the security headers with $kind', async ({ path, signedIn, status, cache }) => {
    const headers = signedIn ? { cookie: (await signIn(fixture.app, 'reviewer')).cookie } : undefined;
    const res = await fixture.app.request(path, { headers });
    expect(res.status).toBe(status);
    expect(res.headers.get('content-security-policy')).toBe(CONTENT_SECURITY_POLICY);
    expect(res.headers.get('x-frame-options')).toBe('DENY');
    expect(res.headers.get('cache-control')).toBe(cache);
  });

  it('shows the demo queue, flagged items first, after signing in', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const res = await fixture.app.request('/', { headers: { cookie } });
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('Review queue');
    const firstRow = html.slice(html.indexOf('<tbody>'), html.indexOf('</tr>', html.indexOf('<tbody>')));
    // the critical demo items are already final, so the highest open flag is 'high'
    expect(firstRow).toContain('sev-high');
    expect(html).toContain('Scores and findings are triage aids, not verdicts');
  });

  it('returns the queue table alone to an htmx request', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const res = await fixture.app.request('/', { headers: { cookie, 'hx-request': 'true' } });
    const html = await res.text();
    expect(html.startsWith('<table class="queue">')).toBe(true);
  });

  it('rejects a wrong password with a message and records the failure', async () => {
    const page = await fixture.app.request('/login');
    const cookie = cookiesFrom(page);
    const res = await fixture.app.request('/login', {
      method: 'POST',
      headers: { cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ username: 'reviewer', password: 'nope', _csrf: csrfFrom(await page.text()) }),
    });
    expect(res.status).toBe(401);
    expect(await res.text()).toContain('do not match an active account');
    const failed = await fixture.store.db.selectFrom('audit_events').select('kind').where('kind', '=', 'login_failed').execute();
    expect(failed.length).toBeGreaterThan(0);
  });

  it('refuses a cross-site login post and a post without its token', async () => {
    const page = await fixture.app.request('/login');
    const cookie = cookiesFrom(page);
    const csrf = csrfFrom(await page.text());
    const body = () => new URLSearchParams({ username: 'reviewer', password: demoPassword('reviewer'), _csrf: csrf });
    const crossSite = await fixture.app.request('/login', { method: 'POST', headers: { cookie, origin: 'https://elsewhere.example', 'content-type': 'application/x-www-form-urlencoded' }, body: body() });
    expect(crossSite.status).toBe(403);
    const noToken = await fixture.app.request('/login', {
      method: 'POST',
      headers: { cookie, origin: ORIGIN, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ username: 'reviewer', password: demoPassword('reviewer') }),
    });
    expect(noToken.status).toBe(403);
    expect(await noToken.text()).toContain('Reload the page');
  });

  it('ends the session on sign-out', async () => {
    const { cookie, csrf } = await signIn(fixture.app, 'reviewer');
    const out = await fixture.app.request('/logout', { method: 'POST', headers: { cookie, origin: ORIGIN, 'x-csrf-token': csrf } });
    expect(out.status).toBe(303);
    const after = await fixture.app.request('/', { headers: { cookie } });
    expect(after.status).toBe(303);
  });

  it('keeps the batch list from a reviewer', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const res = await fixture.app.request('/batches', { headers: { cookie } });
    expect(res.status).toBe(403);
    const data = await signIn(fixture.app, 'data');
    const ok = await fixture.app.request('/batches', { headers: { cookie: data.cookie } });
    expect(ok.status).toBe(200);
    expect(await ok.text()).toContain('Cairnfield support');
  });

  it('renders prompts and responses as text, never as HTML', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const item = await fixture.store.db.selectFrom('responses').select(['id', 'item_id']).orderBy('id').limit(1).executeTakeFirstOrThrow();
    await fixture.store.db.updateTable('responses').set({ text: '<img src=x onerror=alert(1)>\u202Eevil' }).where('id', '=', item.id).execute();
    const html = await (await fixture.app.request(`/items/${item.item_id}`, { headers: { cookie } })).text();
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;⟦U+202E⟧evil');
    expect(html).not.toContain('<img src=x');
  });

  it('answers an unknown page with a 404 page that says what to do', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    const res = await fixture.app.request('/items/999999', { headers: { cookie } });
    expect(res.status).toBe(404);
    expect(await res.text()).toContain('go back to the queue');
  });
});

describe('shortened text in lists', () => {
  it('makes bidi overrides and zero-width characters visible in the queue too', async () => {
    const { cookie } = await signIn(fixture.app, 'reviewer');
    // prompts never change once stored: the hostile one arrives in a batch of its own, first in the queue
    await storeBatch(fixture.store.db, { name: 'bidi', sourceHash: 'bidi', sourceName: 'bidi.jsonl', items: [{ promptId: 'bidi-1', prompt: 'Safe\u202Eesrever\u200B question', responses: [{ responseId: 'a', text: 'A' }, { responseId: 'b', text: 'B' }], priority: 1e6 }] });
    const html = await (await fixture.app.request('/', { headers: { cookie } })).text();
    expect(html).toContain('Safe⟦U+202E⟧esrever⟦U+200B⟧ question');
  });
});
