/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { verifyPassword } from '../../auth/password.ts';
import { recordSignInFailure, signInPause } from '../../auth/throttle.ts';
import { recordAudit } from '../../store/repos/audit.ts';
import { findUserByName } from '../../store/repos/users.ts';
import { LoginPage } from '../../../views/login-page.tsx';
import type { AppEnv } from '../context.ts';
import { endSession, startSession } from '../middleware/session.ts';

/** A `next` target must be a path on this site, never another origin. */
function safeNext(next: unknown): string {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

/** The client's address: the socket's peer (no proxy headers are trusted). */
function clientAddress(c: { env: unknown }): string {
  const incoming = (c.env as { incoming?: { socket?: { remoteAddress?: string } } } | undefined)?.incoming;
  return incoming?.socket?.remoteAddress ?? 'local';
}

/** Sign in and sign out. */
export function authRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/login', (c) => {
    if (c.get('user')) return c.redirect('/', 303);
    return c.html(<LoginPage csrfToken={c.get('csrfToken')} next={safeNext(c.req.query('next'))} />);
  });

  app.post('/login', async (c) => {
    const store = c.get('store');
    const body = await c.req.parseBody();
    const username = typeof body.username === 'string' ? body.username.trim() : '';
    const password = typeof body.password === 'string' ? body.password : '';
    const next = safeNext(body.next);
    const address = clientAddress(c);
    const pause = await signInPause(store.db, username.toLowerCase(), address);
    if (pause) {
      const who = pause.reason === 'account' ? 'this account' : 'your network address';
      return c.html(
        <LoginPage csrfToken={c.get('csrfToken')} next={next} username={username} error={`Too many failed sign-ins for ${who}. Wait about ${pause.minutes} minute${pause.minutes === 1 ? '' : 's'} and try again, or ask an admin to reset your password.`} />,
        429,
      );
    }
    const user = username ? await findUserByName(store.db, username) : undefined;
    const ok = user && !user.disabled && (await verifyPassword(password, user.password_hash));
    if (!user || !ok) {
      await recordSignInFailure(store.db, username.toLowerCase().slice(0, 80), address);
      await recordAudit(store.db, { actorId: user?.id ?? null, kind: 'login_failed', subject: `user:${username.slice(0, 80)}`, detail: { address } });
      return c.html(
        <LoginPage csrfToken={c.get('csrfToken')} next={next} username={username} error="That user name and password do not match an active account. Check both and try again." />,
        401,
      );
    }
    await startSession(c, store, user.id);
    await recordAudit(store.db, { actorId: user.id, kind: 'login', subject: `user:${user.id}` });
    return c.redirect(next, 303);
  });

  app.post('/logout', async (c) => {
    const user = c.get('user');
    await endSession(c, c.get('store'));
    if (user) await recordAudit(c.get('store').db, { actorId: user.id, kind: 'logout', subject: `user:${user.id}` });
    return c.redirect('/login', 303);
  });

  return app;
}
