import type { MiddlewareHandler } from 'hono';
import { hasAnyRole, type Role } from '../../auth/roles.ts';
import { HttpError } from '../../errors.ts';
import type { AppEnv } from '../context.ts';

/**
 * Lets a request through only for a signed-in user holding one of `roles`. Not signed in: a
 * redirect to the login page (htmx gets an HX-Redirect); signed in without the role: 403.
 *
 * @example
 * app.get('/queue', requireRole('reviewer', 'adjudicator'), handler)
 */
export function requireRole(...roles: Role[]): MiddlewareHandler<AppEnv> {
  if (roles.length === 0) throw new Error('requireRole needs at least one role');
  return async function checkRole(c, next) {
    const user = c.get('user');
    if (!user) {
      const target = `/login?next=${encodeURIComponent(c.req.path)}`;
      if (c.req.header('hx-request')) {
        c.header('HX-Redirect', target);
        return c.body(null, 401);
      }
      return c.redirect(target, 303);
    }
    if (!hasAnyRole(user.roles, roles)) {
      throw new HttpError(403, `This page is for the ${roles.join(' or ')} role. Ask an admin if you need it.`);
    }
    return next();
  };
}
