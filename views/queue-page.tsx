/** @jsxImportSource hono/jsx */
import type { QueueFilter, QueueRow } from '../src/store/repos/queue.ts';
import { BAND_NAMES, type Band } from '../src/rubric/spec.ts';
import type { ItemState } from '../src/store/schema.ts';
import type { SessionUser } from '../src/web/context.ts';
import type { HtmlEscapedString } from 'hono/utils/html';
import { Layout } from './layout.tsx';
import { shortText } from './text.tsx';

const STATE_LABELS: Record<ItemState, string> = {
  staged: 'being imported',
  open: 'waiting',
  in_review: 'partly reviewed',
  adjudication: 'needs adjudication',
  final: 'final',
  escalated: 'escalated',
};

export function QueueTable({ rows }: { rows: QueueRow[] }) {
  if (rows.length === 0) return <p class="empty">Nothing is waiting here. Clear the filters, or import a batch to fill the queue.</p>;
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

const BAND_LABELS: Record<Band, string> = { pass: 'pass', review: 'needs a look', fail: 'fail' };

/** The queue's filters: a plain GET form, so a filtered queue is a link that can be shared. */
export function QueueFilters(props: { filter: QueueFilter; batches: { id: number; name: string }[]; checks: readonly string[] }) {
  const { filter } = props;
  return (
    <form class="filters" method="get" action="/" aria-label="Filter the queue">
      <label for="f-batch">Batch</label>
      <select id="f-batch" name="batch">
        <option value="">all batches</option>
        {props.batches.map((b) => <option value={String(b.id)} selected={filter.batchId === b.id}>{b.name}</option>)}
      </select>
      <label for="f-band">Any response in band</label>
      <select id="f-band" name="band">
        <option value="">any band</option>
        {BAND_NAMES.map((b) => <option value={b} selected={filter.band === b}>{BAND_LABELS[b]}</option>)}
      </select>
      <label for="f-check">With findings of</label>
      <select id="f-check" name="check">
        <option value="">any check</option>
        {props.checks.map((id) => <option value={id} selected={filter.check === id}>{id}</option>)}
      </select>
      <label class="inline"><input type="checkbox" name="flagged" value="1" checked={filter.flagged === true} /> flagged only</label>
      <button type="submit">Filter</button>
      {(filter.batchId !== undefined || filter.band || filter.check || filter.flagged) && <a href="/">Clear filters</a>}
    </form>
  );
}

/** The queue page; `table` and `filters` are QueueTable and QueueFilters already rendered (see QueueTableCache). */
export function QueuePage(props: { user: SessionUser; csrfToken: string; table: HtmlEscapedString; filters: HtmlEscapedString; counts: Record<ItemState, number>; filter: QueueFilter }) {
  const { counts } = props;
  return (
    <Layout title="Queue" user={props.user} csrfToken={props.csrfToken}>
      <h1>Review queue</h1>
      {props.user.roles.includes('reviewer') && <p><a class="button" href={props.filter.batchId === undefined ? '/review/next' : `/review/next?batch=${props.filter.batchId}`}>{props.filter.batchId === undefined ? 'Review the next item' : 'Review the next item of this batch'}</a></p>}
      <ul class="counts" aria-label="Items by state">
        <li><strong>{counts.open}</strong> waiting</li>
        <li><strong>{counts.in_review}</strong> partly reviewed</li>
        <li><strong>{counts.adjudication}</strong> need adjudication</li>
        <li><strong>{counts.final}</strong> final</li>
      </ul>
      {props.filters}
      {props.table}
    </Layout>
  );
}
