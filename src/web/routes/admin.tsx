/** @jsxImportSource hono/jsx */
import { Hono } from 'hono';
import { stream } from 'hono/streaming';
import type { Kysely } from 'kysely';
import { recordAudit } from '../../store/repos/audit.ts';
import type { Database } from '../../store/schema.ts';
import { AuditPage } from '../../../views/audit-page.tsx';
import { TokensPage } from '../../../views/tokens-page.tsx';
import { UsersPage } from '../../../views/users-page.tsx';
import { addUserWithPassword, disableUser, findUserById, findUserByName, listUsers, resetUserPassword, USERNAME } from '../../store/repos/users.ts';
import { parseRoles } from '../../auth/roles.ts';
import { HttpError } from '../../errors.ts';
import { createApiToken, listApiTokens, revokeApiToken, TOKEN_SCOPES, type TokenScope } from '../../store/repos/api-tokens.ts';
import type { AppEnv } from '../context.ts';
import { requireRole } from '../middleware/require-role.ts';

export interface AuditFilter {
  kind?: string;
  actor?: string;
  since?: string;
}

function auditQuery(db: Kysely<Database>, filter: AuditFilter) {
  let q = db
    .selectFrom('audit_events')
    .leftJoin('users', 'users.id', 'audit_events.actor_id')
    .select(['audit_events.id', 'audit_events.at', 'audit_events.kind', 'audit_events.subject', 'audit_events.detail', 'users.username as actor']);
  if (filter.kind) q = q.where('audit_events.kind', '=', filter.kind);
  if (filter.actor) q = q.where('users.username', '=', filter.actor);
  if (filter.since) q = q.where('audit_events.at', '>=', filter.since);
  return q;
}

function filterFrom(query: (name: string) => string | undefined): AuditFilter {
  const clean = (v: string | undefined) => (v && v.trim() ? v.trim().slice(0, 100) : undefined);
  const since = clean(query('since'));
  return { kind: clean(query('kind')), actor: clean(query('actor')), since: since && /^\d{4}-\d{2}-\d{2}/.test(since) ? since : undefined };
}

/** Admin pages: users (add, disable, reset passwords), the audit log (filter, export as JSON Lines) and API tokens (create, revoke). */
export function adminRoutes() {
  const app = new Hono<AppEnv>();

  app.get('/admin/audit', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const filter = filterFrom((n) => c.req.query(n));
    const events = await auditQuery(db, filter).orderBy('audit_events.id', 'desc').limit(300).execute();
    const kinds = (await db.selectFrom('audit_events').select('kind').distinct().orderBy('kind').execute()).map((k) => k.kind);
    return c.html(<AuditPage user={c.get('user')!} csrfToken={c.get('csrfToken')} events={events} kinds={kinds} filter={filter} />);
  });

  app.get('/admin/audit.jsonl', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const filter = filterFrom((n) => c.req.query(n));
    await recordAudit(db, { actorId: c.get('user')!.id, kind: 'audit_export', detail: { ...filter } });
    c.header('Content-Type', 'application/x-ndjson; charset=utf-8');
    c.header('Content-Disposition', 'attachment; filename="plumbline-audit.jsonl"');
    return stream(c, async (out) => {
      let after = 0;
      for (;;) {
        const page = await auditQuery(db, filter).where('audit_events.id', '>', after).orderBy('audit_events.id', 'asc').limit(1000).execute();
        if (!page.length) break;
        await out.write(page.map((e) => JSON.stringify({ id: e.id, at: e.at, actor: e.actor, kind: e.kind, subject: e.subject, detail: e.detail ? JSON.parse(e.detail) : null })).join('\n') + '\n');
        after = page[page.length - 1].id;
      }
    });
  });

  app.get('/admin/users', requireRole('admin'), async (c) => {
    return c.html(<UsersPage user={c.get('user')!} csrfToken={c.get('csrfToken')} users={await listUsers(c.get('store').db)} />);
  });

  app.post('/admin/users', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody({ all: true });
    const username = typeof body.username === 'string' ? body.username.trim() : '';
    const roles = parseRoles(([] as unknown[]).concat(body.roles ?? []).filter((r): r is string => typeof r === 'string').join(','));
    const again = async (error: string) => c.html(<UsersPage user={c.get('user')!} csrfToken={c.get('csrfToken')} users={await listUsers(db)} error={error} />, 422);
    if (!USERNAME.test(username)) return again('A user name is 2–40 lower-case letters, digits, dots, hyphens or underscores.');
    if (!roles.length) return again('Give the user at least one role.');
    if (await findUserByName(db, username)) return again(`A user named "${username}" already exists. Reset their password instead.`);
    const displayName = typeof body.display_name === 'string' && body.display_name.trim() ? body.display_name.trim().slice(0, 80) : username;
    const { password } = await addUserWithPassword(db, { username, displayName, roles }, c.get('user')!.id, 'web');
    return c.html(<UsersPage user={c.get('user')!} csrfToken={c.get('csrfToken')} users={await listUsers(db)} shown={{ username, password }} />, 201);
  });

  app.post('/admin/users/:id{[0-9]+}/disable', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const target = await findUserById(db, Number(c.req.param('id')));
    if (!target) throw new HttpError(404, 'There is no such user.');
    if (target.id === c.get('user')!.id) throw new HttpError(422, 'You cannot disable your own account. Ask another admin.');
    await disableUser(db, target.id, c.get('user')!.id, 'web');
    return c.redirect('/admin/users', 303);
  });

  app.post('/admin/users/:id{[0-9]+}/reset-password', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const target = await findUserById(db, Number(c.req.param('id')));
    if (!target) throw new HttpError(404, 'There is no such user.');
    const password = await resetUserPassword(db, target.id, c.get('user')!.id, 'web');
    return c.html(<UsersPage user={c.get('user')!} csrfToken={c.get('csrfToken')} users={await listUsers(db)} shown={{ username: target.username, password }} />);
  });

  app.get('/admin/tokens', requireRole('admin'), async (c) => {
    return c.html(<TokensPage user={c.get('user')!} csrfToken={c.get('csrfToken')} tokens={await listApiTokens(c.get('store').db)} />);
  });

  app.post('/admin/tokens', requireRole('admin'), async (c) => {
    const { db } = c.get('store');
    const body = await c.req.parseBody({ all: true });
    const name = typeof body.name === 'string' ? body.name.trim().slice(0, 80) : '';
    const asked = ([] as unknown[]).concat(body.scopes ?? []).filter((s): s is string => typeof s === 'string');
    const scopes = asked.filter((s): s is TokenScope => (TOKEN_SCOPES as readonly string[]).includes(s));
    if (!name || !scopes.length) {
      return c.html(<TokensPage user={c.get('user')!} csrfToken={c.get('csrfToken')} tokens={await listApiTokens(db)} error="Give the token a name and at least one scope." />, 422);
    }
    const created = await createApiToken(db, { name, scopes, createdBy: c.get('user')!.id });
    return c.html(<TokensPage user={c.get('user')!} csrfToken={c.get('csrfToken')} tokens={await listApiTokens(db)} created={{ name, token: created.token }} />, 201);
  });

  app.post('/admin/tokens/:id{[0-9]+}/revoke', requireRole('admin'), async (c) => {
    await revokeApiToken(c.get('store').db, Number(c.req.param('id')), c.get('user')!.id);
    return c.redirect('/admin/tokens', 303);
  });

  return app;
}
