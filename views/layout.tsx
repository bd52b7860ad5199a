/** @jsxImportSource hono/jsx */
import type { Child } from 'hono/jsx';
import { raw } from 'hono/html';
import type { SessionUser } from '../src/web/context.ts';
import { hasAnyRole } from '../src/auth/roles.ts';

export interface LayoutProps {
  title: string;
  user: SessionUser | null;
  csrfToken: string;
  children?: Child;
}

/** htmx settings: no eval, no inline indicator styles, no scripts from responses, same-origin only. */
const HTMX_CONFIG = JSON.stringify({
  allowEval: false,
  allowScriptTags: false,
  includeIndicatorStyles: false,
  selfRequestsOnly: true,
  historyCacheSize: 0,
});

/** The page frame: header with navigation for the user's roles, main content, and the standing caution. */
export function Layout({ title, user, csrfToken, children }: LayoutProps) {
  return (
    <>
    {raw('<!doctype html>')}
    <html lang="en">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="htmx-config" content={HTMX_CONFIG} />
        <meta name="csrf-token" content={csrfToken} />
        <title>{`${title} · Plumbline`}</title>
        <link rel="icon" href="/static/favicon.svg" type="image/svg+xml" />
        <link rel="stylesheet" href="/static/plumbline.css" />
        <script src="/static/htmx.min.js" defer></script>
        <script src="/static/plumbline.js" defer></script>
      </head>
      <body>
        <a class="skip-link" href="#main">Skip to content</a>
        <header class="top">
          <a class="brand" href="/">Plumbline</a>
          {user && (
            <nav aria-label="Main">
              <ul>
                {hasAnyRole(user.roles, ['reviewer', 'adjudicator', 'policy', 'data', 'admin']) && <li><a href="/">Queue</a></li>}
                {hasAnyRole(user.roles, ['adjudicator']) && <li><a href="/adjudicate">Adjudication</a></li>}
                {hasAnyRole(user.roles, ['data', 'admin']) && <li><a href="/batches">Batches</a></li>}
                {hasAnyRole(user.roles, ['policy', 'admin', 'data', 'adjudicator']) && <li><a href="/rubrics">Rubrics</a></li>}
                {hasAnyRole(user.roles, ['policy', 'admin', 'data', 'adjudicator']) && <li><a href="/stats">Statistics</a></li>}
                {hasAnyRole(user.roles, ['admin']) && <li><a href="/admin/users">Users</a></li>}
                {hasAnyRole(user.roles, ['admin']) && <li><a href="/admin/audit">Audit log</a></li>}
                {hasAnyRole(user.roles, ['admin']) && <li><a href="/admin/tokens">API tokens</a></li>}
              </ul>
            </nav>
          )}
          {user && (
            <form class="signout" method="post" action="/logout">
              <input type="hidden" name="_csrf" value={csrfToken} />
              <span class="who">{user.displayName}</span>
              <button type="submit">Sign out</button>
            </form>
          )}
        </header>
        <main id="main" tabindex={-1}>
          {children}
        </main>
        <footer class="caution" role="note">
          Scores and findings are triage aids, not verdicts on truth or safety; every decision here is a person's.
          Exports may hold harmful text and personal data: handle them under your organisation's data policy.
        </footer>
      </body>
    </html>
    </>
  );
}
