/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';
import { shortText, UntrustedText } from './text.tsx';

export interface AdjudicationRow {
  id: number;
  prompt_id: string;
  prompt: string;
  state: string;
  batch: string;
  reviews: number;
}

export function AdjudicationQueuePage(props: { user: SessionUser; csrfToken: string; rows: AdjudicationRow[] }) {
  return (
    <Layout title="Adjudication" user={props.user} csrfToken={props.csrfToken}>
      <h1>Items needing a decision</h1>
      {props.rows.length === 0 ? (
        <p class="empty">No item needs adjudication.</p>
      ) : (
        <table>
          <caption>Reviewers disagreed, or a reviewer escalated</caption>
          <thead><tr><th scope="col">Prompt</th><th scope="col">Why</th><th scope="col">Reviews</th><th scope="col">Batch</th></tr></thead>
          <tbody>
            {props.rows.map((r) => (
              <tr><td><a href={`/adjudicate/${r.id}`}>{shortText(r.prompt, 100)}</a><div class="muted">{r.prompt_id}</div></td><td>{r.state === 'escalated' ? 'escalated' : 'reviewers disagree'}</td><td>{r.reviews}</td><td>{r.batch}</td></tr>
            ))}
          </tbody>
        </table>
      )}
    </Layout>
  );
}

export interface ReviewColumn {
  reviewer: string;
  status: string;
  ranking: Record<string, number> | null;
  rationale: string | null;
  reason: string | null;
}

export function AdjudicationPage(props: {
  user: SessionUser;
  /** Characters the rationale needs (the batch's setting). */
  minRationale: number;
  csrfToken: string;
  itemId: number;
  promptId: string;
  prompt: string;
  candidates: { responseId: string; text: string; score: number | null; band: string | null; suggested: number | null; findings: string[] }[];
  reviews: ReviewColumn[];
  error?: string;
}) {
  const k = props.candidates.length;
  return (
    <Layout title={`Decide ${props.promptId}`} user={props.user} csrfToken={props.csrfToken}>
      <p><a href="/adjudicate">Back to the items needing a decision</a></p>
      <h1>{`Decide ${props.promptId}`}</h1>
      {props.error && <div class="error-box" role="alert">{props.error}</div>}
      <UntrustedText class="prompt" text={props.prompt} />
      <table class="side-by-side">
        <caption>Every reviewer's ranking side by side (1 is best)</caption>
        <thead>
          <tr><th scope="col">Candidate</th>{props.reviews.map((r) => <th scope="col">{r.reviewer}</th>)}<th scope="col">Suggested</th></tr>
        </thead>
        <tbody>
          {props.candidates.map((c) => (
            <tr><th scope="row">{c.responseId}</th>{props.reviews.map((r) => <td>{r.ranking ? String(r.ranking[c.responseId] ?? '—') : r.status}</td>)}<td>{c.suggested ?? '—'}</td></tr>
          ))}
        </tbody>
      </table>
      <h2>Rationales</h2>
      <ul class="rationales">
        {props.reviews.map((r) => <li><strong>{`${r.reviewer}: `}</strong>{r.rationale ?? r.reason ?? '—'}</li>)}
      </ul>
      <form method="post" action={`/adjudicate/${props.itemId}`}>
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <ol class="candidates">
          {props.candidates.map((c, i) => (
            <li class="candidate">
              <div class="candidate-head">
                <h3>{`Candidate ${c.responseId}`}</h3>
                <label for={`rank-${c.responseId}`}>Final rank</label>
                <input id={`rank-${c.responseId}`} class="rank" name={`rank_${c.responseId}`} type="number" min={1} max={k} required value={String(c.suggested ?? i + 1)} />
                {c.band && <span class={`band band-${c.band}`}>{`${c.band} · ${c.score}`}</span>}
              </div>
              <UntrustedText text={c.text} />
              {c.findings.length > 0 && <ul class="findings">{c.findings.map((f) => <li>{f}</li>)}</ul>}
            </li>
          ))}
        </ol>
        <label for="rationale">{`Rationale for the decision (at least ${props.minRationale} characters)`}</label>
        <textarea id="rationale" name="rationale" rows={4} required minlength={props.minRationale}></textarea>
        <button type="submit">Record the final ranking</button>
      </form>
    </Layout>
  );
}
