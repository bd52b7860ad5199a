/** @jsxImportSource hono/jsx */
import type { BatchSummary } from '../src/store/repos/batches.ts';
import type { RubricSummary } from '../src/store/repos/rubrics.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

export function BatchesPage(props: { user: SessionUser; csrfToken: string; batches: BatchSummary[]; rubrics: RubricSummary[]; error?: string }) {
  return (
    <Layout title="Batches" user={props.user} csrfToken={props.csrfToken}>
      <h1>Batches</h1>
      {props.error && <div class="error-box" role="alert"><p>{props.error}</p></div>}
      {props.batches.length === 0 ? (
        <p class="empty">No batches yet.</p>
      ) : (
        <table>
          <caption>Imported batches, newest first</caption>
          <thead><tr><th scope="col">Name</th><th scope="col">Imported</th><th scope="col">Items</th><th scope="col">Final</th><th scope="col">Export</th></tr></thead>
          <tbody>
            {props.batches.map((b) => (
              <tr>
                <td><a href={`/?batch=${b.id}`}>{b.name}</a></td>
                <td>{b.created_at.slice(0, 16).replace('T', ' ')}</td>
                <td>{b.items}</td>
                <td>{b.final}</td>
                <td><a href={`/export?format=pairs&batch=${encodeURIComponent(b.name)}`}>pairs</a> · <a href={`/export?format=rankings&batch=${encodeURIComponent(b.name)}`}>rankings</a> · <a href={`/export?format=pairs&redact=1&batch=${encodeURIComponent(b.name)}`}>pairs, personal data removed</a></td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p class="muted">Exports may hold harmful text and personal data: handle them under your organisation's data policy. The CLI (<code>plumbline export</code>) also writes a data card.</p>
      <h2>Import a batch</h2>
      <form method="post" action="/batches/import" enctype="multipart/form-data">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <label for="file">File (JSON Lines or CSV)</label>
        <input id="file" name="file" type="file" accept=".jsonl,.ndjson,.json,.csv" required />
        <label for="name">Batch name</label>
        <input id="name" name="name" required maxlength={120} />
        <label for="rubric">Rubric</label>
        <select id="rubric" name="rubric">{props.rubrics.map((r) => <option value={r.id} selected={r.id === 'general'}>{r.title}</option>)}</select>
        <label for="reviews">Reviews per item</label>
        <input id="reviews" name="reviews" type="number" min={1} max={5} value="1" />
        <label for="rationale_min">Minimum rationale length (characters)</label>
        <input id="rationale_min" name="rationale_min" type="number" min={0} max={2000} value="20" />
        <button type="submit">Import</button>
      </form>
    </Layout>
  );
}
