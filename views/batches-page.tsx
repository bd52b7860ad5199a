/** @jsxImportSource hono/jsx */
import type { BatchSummary } from '../src/store/repos/batches.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

export function BatchesPage(props: { user: SessionUser; csrfToken: string; batches: BatchSummary[] }) {
  return (
    <Layout title="Batches" user={props.user} csrfToken={props.csrfToken}>
      <h1>Batches</h1>
      {props.batches.length === 0 ? (
        <p class="empty">No batches yet. Import one with <code>plumbline import FILE --batch NAME</code>.</p>
      ) : (
        <table>
          <caption>Imported batches, newest first</caption>
          <thead><tr><th scope="col">Name</th><th scope="col">Imported</th><th scope="col">Items</th><th scope="col">Final</th></tr></thead>
          <tbody>
            {props.batches.map((b) => (
              <tr><td><a href={`/?batch=${b.id}`}>{b.name}</a></td><td>{b.created_at.slice(0, 16).replace('T', ' ')}</td><td>{b.items}</td><td>{b.final}</td></tr>
            ))}
          </tbody>
        </table>
      )}
    </Layout>
  );
}
