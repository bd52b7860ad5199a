/** @jsxImportSource hono/jsx */
import type { QueueRow } from '../src/store/repos/queue.ts';
import type { ItemState } from '../src/store/schema.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';
import { shortText } from './text.tsx';

const STATE_LABELS: Record<ItemState, string> = {
  open: 'waiting',
  in_review: 'partly reviewed',
  adjudication: 'needs adjudication',
  final: 'final',
  escalated: 'escalated',
};

export function QueueTable({ rows }: { rows: QueueRow[] }) {
  if (rows.length === 0) return <p class="empty">Nothing is waiting. Import a batch to fill the queue.</p>;
  return (
    <table class="queue">
      <caption>Items in triage order: the riskiest and most uncertain first</caption>
      <thead>
        <tr>
          <th scope="col">#</th>
          <th scope="col">Prompt</th>
          <th scope="col">Flag</th>
          <th scope="col">Candidates</th>
          <th scope="col">Reviews</th>
          <th scope="col">State</th>
          <th scope="col">Batch</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row, i) => (
          <tr>
            <td>{i + 1}</td>
            <td>
              <a href={`/items/${row.id}`}>{shortText(row.prompt, 110)}</a>
              <div class="muted">{row.prompt_id}</div>
            </td>
            <td>{row.flag_severity ? <span class={`sev sev-${row.flag_severity}`}>{row.flag_severity}</span> : <span class="muted">—</span>}{row.flag_reason && <div class="muted">{row.flag_reason}</div>}</td>
            <td>{row.responses}</td>
            <td>{`${row.reviews} of ${row.reviews_required}`}</td>
            <td>{STATE_LABELS[row.state]}</td>
            <td>{row.batch_name}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function QueuePage(props: { user: SessionUser; csrfToken: string; rows: QueueRow[]; counts: Record<ItemState, number> }) {
  const { counts } = props;
  return (
    <Layout title="Queue" user={props.user} csrfToken={props.csrfToken}>
      <h1>Review queue</h1>
      {props.user.roles.includes('reviewer') && <p><a class="button" href="/review/next">Review the next item</a></p>}
      <ul class="counts" aria-label="Items by state">
        <li><strong>{counts.open}</strong> waiting</li>
        <li><strong>{counts.in_review}</strong> partly reviewed</li>
        <li><strong>{counts.adjudication}</strong> need adjudication</li>
        <li><strong>{counts.final}</strong> final</li>
      </ul>
      <QueueTable rows={props.rows} />
    </Layout>
  );
}
