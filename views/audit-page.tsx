/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import type { AuditFilter } from '../src/web/routes/admin.tsx';
import { Layout } from './layout.tsx';
import { shortText } from './text.tsx';

interface AuditRow {
  id: number;
  at: string;
  kind: string;
  subject: string | null;
  detail: string | null;
  actor: string | null;
}

export function AuditPage(props: { user: SessionUser; csrfToken: string; events: AuditRow[]; kinds: string[]; filter: AuditFilter }) {
  const { filter } = props;
  const query = new URLSearchParams(Object.entries(filter).filter(([, v]) => v) as [string, string][]).toString();
  return (
    <Layout title="Audit log" user={props.user} csrfToken={props.csrfToken}>
      <h1>Audit log</h1>
      <p class="muted">Append-only: sign-ins, failed sign-ins, imports, reviews, reveals, decisions, rubric publishes, exports and user changes.</p>
      <form method="get" action="/admin/audit" class="filters">
        <label for="kind">Kind</label>
        <select id="kind" name="kind">
          <option value="">any</option>
          {props.kinds.map((k) => <option value={k} selected={filter.kind === k}>{k}</option>)}
        </select>
        <label for="actor">User</label>
        <input id="actor" name="actor" value={filter.actor ?? ''} />
        <label for="since">Since (YYYY-MM-DD)</label>
        <input id="since" name="since" value={filter.since ?? ''} />
        <button type="submit">Filter</button>
      </form>
      <p><a href={`/admin/audit.jsonl${query ? `?${query}` : ''}`}>Download these events as JSON Lines</a></p>
      <table>
        <caption>{`Newest first (${props.events.length} shown, at most 300; the download has them all)`}</caption>
        <thead><tr><th scope="col">When (UTC)</th><th scope="col">Who</th><th scope="col">What</th><th scope="col">Subject</th><th scope="col">Detail</th></tr></thead>
        <tbody>
          {props.events.map((e) => (
            <tr><td>{e.at.slice(0, 19).replace('T', ' ')}</td><td>{e.actor ?? '—'}</td><td>{e.kind}</td><td>{e.subject ?? ''}</td><td><code>{shortText(e.detail ?? '', 160)}</code></td></tr>
          ))}
        </tbody>
      </table>
    </Layout>
  );
}
