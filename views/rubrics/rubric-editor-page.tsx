/** @jsxImportSource hono/jsx */
import type { Impact } from '../../src/rubric/impact.ts';
import type { Problem } from '../../src/rubric/validate.ts';
import type { BatchSummary } from '../../src/store/repos/batches.ts';
import type { SessionUser } from '../../src/web/context.ts';
import { Layout } from '../layout.tsx';

/** The live list of problems under the editor (an htmx fragment). */
export function ProblemList({ problems, version }: { problems: Problem[]; version?: string }) {
  if (!problems.length) return <p class="ok" role="status">{`No problems.${version ? ` This draft would be version ${version}.` : ''}`}</p>;
  return (
    <div role="alert">
      <p>{`${problems.length} problem${problems.length === 1 ? '' : 's'} — the draft cannot be published until they are fixed:`}</p>
      <ul class="problems">
        {problems.map((p) => (
          <li><code>{`line ${p.line}, column ${p.column}`}</code>{` ${p.message}`}</li>
        ))}
      </ul>
    </div>
  );
}

/** What the draft would change on a batch (an htmx fragment). */
export function ImpactReport({ impact, batchName }: { impact: Impact; batchName: string }) {
  const pct = (x: number | null) => (x === null ? 'n/a' : `${(x * 100).toFixed(1)}%`);
  return (
    <section aria-label="Impact preview">
      <h3>{`Impact on "${batchName}": ${impact.items} items, ${impact.responses} responses re-scored`}</h3>
      <p>{`Agreement of the suggested order with final human rankings (${impact.humanAgreement.items} decided items): ${pct(impact.humanAgreement.before)} now → ${pct(impact.humanAgreement.after)} with the draft.`}</p>
      <table>
        <caption>{`Items that move most in the queue (${impact.moves.length} move)`}</caption>
        <thead><tr><th scope="col">Item</th><th scope="col">Position now</th><th scope="col">With the draft</th><th scope="col">Moved</th></tr></thead>
        <tbody>{impact.moves.slice(0, 15).map((m) => <tr><td>{m.promptId}</td><td>{m.before}</td><td>{m.after}</td><td>{m.moved > 0 ? `up ${m.moved}` : `down ${-m.moved}`}</td></tr>)}</tbody>
      </table>
      <table>
        <caption>{`Candidates that change band (${impact.bandChanges.length})`}</caption>
        <thead><tr><th scope="col">Item</th><th scope="col">Candidate</th><th scope="col">Band now</th><th scope="col">With the draft</th><th scope="col">Score</th></tr></thead>
        <tbody>{impact.bandChanges.slice(0, 30).map((b) => <tr><td>{b.promptId}</td><td>{b.responseId}</td><td>{b.before}</td><td>{b.after}</td><td>{`${b.scoreBefore} → ${b.scoreAfter}`}</td></tr>)}</tbody>
      </table>
      <table>
        <caption>{`Suggested orders that change (${impact.orderChanges.length})`}</caption>
        <thead><tr><th scope="col">Item</th><th scope="col">Order now</th><th scope="col">With the draft</th></tr></thead>
        <tbody>{impact.orderChanges.slice(0, 30).map((o) => <tr><td>{o.promptId}</td><td>{o.before.join(' > ')}</td><td>{o.after.join(' > ')}</td></tr>)}</tbody>
      </table>
    </section>
  );
}

export function RubricEditorPage(props: { user: SessionUser; csrfToken: string; rubricId: string; source: string; problems: Problem[]; version?: string; batches: BatchSummary[]; error?: string }) {
  const { rubricId } = props;
  return (
    <Layout title={`Edit ${rubricId}`} user={props.user} csrfToken={props.csrfToken}>
      <p><a href={`/rubrics/${rubricId}`}>{`Back to ${rubricId}`}</a></p>
      <h1>{`Draft of ${rubricId}`}</h1>
      <p class="muted">The draft is checked as you type. Nothing changes until you publish; preview shows what it would do first.</p>
      {props.error && <div class="error-box" role="alert">{props.error}</div>}
      <form method="post" action={`/rubrics/${rubricId}/publish`} id="draft-form">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <label for="source">Rubric file (YAML)</label>
        <textarea id="source" name="source" rows={28} spellcheck={false} hx-post="/rubrics/validate" hx-trigger="keyup changed delay:400ms" hx-target="#problems" hx-swap="innerHTML">{props.source}</textarea>
        <div id="problems" aria-live="polite"><ProblemList problems={props.problems} version={props.version} /></div>
        <fieldset>
          <legend>Preview on a batch</legend>
          <label for="batch">Batch</label>
          <select id="batch" name="batch">
            {props.batches.map((b) => <option value={String(b.id)}>{`${b.name} (${b.items} items)`}</option>)}
          </select>
          <button type="button" hx-post={`/rubrics/${rubricId}/preview`} hx-include="#draft-form" hx-target="#impact" hx-swap="innerHTML">Preview impact</button>
        </fieldset>
        <div id="impact" aria-live="polite"></div>
        <fieldset>
          <legend>Publish</legend>
          <label for="note">Note for the history (what changed and why)</label>
          <input id="note" name="note" maxlength={500} />
          <button type="submit">Publish as a new version</button>
        </fieldset>
      </form>
      <form method="post" action={`/rubrics/${rubricId}/upload`} enctype="multipart/form-data" class="upload">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <label for="file">Or load a draft from a file</label>
        <input id="file" name="file" type="file" accept=".yaml,.yml" />
        <button type="submit">Load into the editor</button>
      </form>
    </Layout>
  );
}
