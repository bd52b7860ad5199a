import type { Store } from '../store/connect.ts';
import type { Role } from '../auth/roles.ts';

/** The signed-in user as routes see it. */
export interface SessionUser {
  id: number;
  username: string;
  displayName: string;
  roles: Role[];
  csrfToken: string;
}

/** Variables the middleware puts on Hono's context. */
export interface AppEnv {
  Variables: {
    store: Store;
    user: SessionUser | null;
    /** Token the page embeds for forms and htmx requests. */
    csrfToken: string;
    secureCookies: boolean;
    /** Set by requireToken on API routes. */
    apiToken?: { id: number; name: string; scopes: string[]; createdBy: number | null };
  };
}
