/** @jsxImportSource hono/jsx */
import type { ScoredFinding } from '../src/rubric/score.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';
import { revealInvisible, UntrustedText } from './text.tsx';

export interface ReviewCandidate {
  responseId: string;
  label: string;
  text: string;
  score?: { overall: number; band: string; suggestedRank: number; criteria: Record<string, { band: string }>; findings: ScoredFinding[] };
}

/** Text with finding spans marked; spans from critical criteria stay hidden until the reviewer shows them. */
function Highlighted({ text, findings }: { text: string; findings: ScoredFinding[] }) {
  const spans = [...findings].filter((f) => f.end > f.start).sort((a, b) => a.start - b.start);
  const parts: unknown[] = [];
  let at = 0;
  for (const f of spans) {
    if (f.start < at) continue;
    parts.push(revealInvisible(text.slice(at, f.start)));
    const body = revealInvisible(text.slice(f.start, f.end));
    parts.push(
      f.severity === 'critical' ? (
        <span class="finding masked" data-masked="true" tabindex={0} role="button" aria-label={`Hidden ${f.criterion} evidence: ${f.message}. Press Enter to show.`} title={f.message}>
          <span class="mask-label">{`[${f.criterion}: hidden — show]`}</span>
          <span class="mask-body" hidden>{body}</span>
        </span>
      ) : (
        <mark class={`finding sev-${f.severity}`} title={`${f.criterion}: ${f.message}`}>{body}</mark>
      ),
    );
    at = f.end;
  }
  parts.push(revealInvisible(text.slice(at)));
  return <div class="untrusted">{parts}</div>;
}

export function ReviewPage(props: {
  user: SessionUser;
  csrfToken: string;
  itemId: number;
  promptId: string;
  prompt: string;
  flag: string | null;
  candidates: ReviewCandidate[];
  revealed: boolean;
  firstRanking: Record<string, number> | null;
  startedAt: string;
  warning: string | null;
  error?: string;
  minRationale: number;
  reviewedToday: number;
  dailyLimit: number;
}) {
  const { candidates, revealed } = props;
  const k = candidates.length;
  const order = candidates.map((c) => c.responseId).join(',');
  return (
    <Layout title={`Review ${props.promptId}`} user={props.user} csrfToken={props.csrfToken}>
      <p class="muted">{`Item ${props.promptId}${props.flag ? ` · flagged: ${props.flag}` : ''} · you have reviewed ${props.reviewedToday} today (suggested limit ${props.dailyLimit})`}</p>
      {props.warning && <div class="content-warning" role="note">{`Content warning: ${props.warning}. Hidden passages stay hidden until you choose to show them; you may skip this item without penalty.`}</div>}
      {props.error && <div class="error-box" role="alert">{props.error}</div>}
      <h1>Prompt</h1>
      <UntrustedText class="prompt" text={props.prompt} />
      <form method="post" action={`/review/${props.itemId}/${revealed ? 'submit' : 'reveal'}`} class="ranking-form">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <input type="hidden" name="order" value={order} />
        <input type="hidden" name="started_at" value={props.startedAt} />
        {props.firstRanking && <input type="hidden" name="first" value={JSON.stringify(props.firstRanking)} />}
        <p class="muted">{revealed ? 'Your first ranking is saved. The findings and the suggested order are shown; revise if they change your mind — or keep your ranking.' : `Rank the ${k} candidates: 1 is best; equal numbers are ties. Scores and findings stay hidden until you commit this first ranking.`}</p>
        <ol class="candidates" id="candidates">
          {candidates.map((c, i) => (
            <li class="candidate" data-response={c.responseId}>
              <div class="candidate-head">
                <h2>{`Candidate ${c.label}`}</h2>
                <label for={`rank-${c.responseId}`}>Rank</label>
                <input id={`rank-${c.responseId}`} class="rank" name={`rank_${c.responseId}`} type="number" min={1} max={k} required value={String(revealed && props.firstRanking ? props.firstRanking[c.responseId] : i + 1)} />
                {revealed && c.score && <span class={`band band-${c.score.band}`}>{`${c.score.band} · ${c.score.overall} · suggested ${c.score.suggestedRank}`}</span>}
              </div>
              {revealed && c.score ? <Highlighted text={c.text} findings={c.score.findings} /> : <UntrustedText text={c.text} />}
              {revealed && c.score && c.score.findings.length > 0 && (
                <ul class="findings">{c.score.findings.map((f) => <li>{`${f.criterion} (${f.severity}): ${f.message}`}</li>)}</ul>
              )}
            </li>
          ))}
        </ol>
        {revealed && (
          <>
            <label for="rationale">{`Rationale (at least ${props.minRationale} characters): what decided the order?`}</label>
            <textarea id="rationale" name="rationale" rows={4} required minlength={props.minRationale}></textarea>
          </>
        )}
        <button type="submit">{revealed ? 'Submit ranking' : 'Commit first ranking and reveal findings'}</button>
      </form>
      <form method="post" action={`/review/${props.itemId}/skip`} class="skip-form">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <input type="hidden" name="order" value={order} />
        <input type="hidden" name="started_at" value={props.startedAt} />
        <label for="reason">Skip or escalate — reason</label>
        <input id="reason" name="reason" required maxlength={300} />
        <button type="submit" name="action" value="skip">Skip (no penalty)</button>
        <button type="submit" name="action" value="escalate">Escalate</button>
      </form>
      <p class="muted">Scores and findings are triage aids; the ranking is your judgement.</p>
    </Layout>
  );
}
