/** @jsxImportSource hono/jsx */
import type { BatchSummary } from '../src/store/repos/batches.ts';
import type { BatchStatistics } from '../src/store/repos/statistics-data.ts';
import type { LearnedWeights } from '../src/stats/learn-weights.ts';
import type { SessionUser } from '../src/web/context.ts';
import { hasAnyRole } from '../src/auth/roles.ts';
import { BarChart } from './bar-chart.tsx';
import { Layout } from './layout.tsx';

const pct = (v: number | null | undefined) => (v === null || v === undefined ? 'n/a' : `${(v * 100).toFixed(1)}%`);

export function StatsPage(props: { user: SessionUser; csrfToken: string; batches: BatchSummary[]; selected: number | null; stats: BatchStatistics; rubricId: string | null }) {
  const { stats, selected } = props;
  const c = stats.calibration;
  const ra = stats.reviewerAgreement;
  return (
    <Layout title="Statistics" user={props.user} csrfToken={props.csrfToken}>
      <h1>Statistics</h1>
      <form method="get" action="/stats" class="filters">
        <label for="batch">Batch</label>
        <select id="batch" name="batch">
          <option value="all" selected={selected === null}>All batches</option>
          {props.batches.map((b) => <option value={String(b.id)} selected={selected === b.id}>{b.name}</option>)}
        </select>
        <button type="submit">Show</button>
      </form>
      <p class="muted">Figures from small samples move a lot; read them as prompts for a conversation, not as grades.</p>

      <h2>Reviewers agreeing with each other</h2>
      <p>{`Mean pairwise agreement between reviewers of the same item: ${pct(ra.value)}${ra.interval ? ` (95% bootstrap interval ${pct(ra.interval.low)}–${pct(ra.interval.high)})` : ''}, over ${ra.items} items with two or more reviews. Published human–human agreement on pairwise preferences is about 72–77% (Ouyang et al. 2022; Stiennon et al. 2020).`}</p>

      <BarChart
        title="Heuristics against final decisions"
        description={`Pairwise accuracy over ${c.suggestedOrder.pairs} decided pairs; 50% is chance.`}
        reference={{ at: 0.5, label: 'chance' }}
        bars={[{ label: 'suggested order', value: c.suggestedOrder.value, note: `${c.suggestedOrder.pairs} pairs` }, ...Object.entries(c.criteria).map(([id, s]) => ({ label: id, value: s.value, note: `${s.pairs} pairs` }))]}
      />
      <BarChart
        title="Possible biases"
        description="Shares of decided or reviewed pairs; 50% means no bias."
        reference={{ at: 0.5, label: 'no bias' }}
        bars={[
          { label: 'longer response won', value: c.lengthBias.value, note: `${c.lengthBias.pairs} pairs` },
          { label: 'shown earlier ranked better', value: c.positionBias.value, note: `${c.positionBias.pairs} pairs (blind rankings)` },
          { label: 'revisions toward the suggestion', value: c.anchoring.share, note: `${c.anchoring.towardSuggested} of ${c.anchoring.revisions} revisions after the reveal` },
        ]}
      />
      <BarChart
        title="Each reviewer's agreement with the final decisions"
        description="For calibration and coaching, shown with care: disagreement with a decision is not an error."
        bars={Object.entries(c.reviewers).map(([id, s]) => ({ label: id, value: s.value, note: `${s.pairs} items` }))}
      />

      <h2>Exposure</h2>
      <table>
        <caption>Reviews per reviewer (skips never count against anyone)</caption>
        <thead><tr><th scope="col">Reviewer</th><th scope="col">Today</th><th scope="col">In total</th><th scope="col">Skipped</th></tr></thead>
        <tbody>{stats.exposure.map((e) => <tr><td>{e.reviewer}</td><td>{e.today}</td><td>{e.total}</td><td>{e.skipped}</td></tr>)}</tbody>
      </table>

      {selected !== null && props.rubricId && hasAnyRole(props.user.roles, ['policy']) && (
        <form method="post" action="/stats/weights" class="weights">
          <input type="hidden" name="_csrf" value={props.csrfToken} />
          <input type="hidden" name="batch" value={String(selected)} />
          <h2>Learn weights from the decisions</h2>
          <p>{`Fits the weights of "${props.rubricId}" to this batch's final rankings and compares held-out accuracy. The result is offered as a draft; nothing changes unless you publish it.`}</p>
          <button type="submit">Fit weights</button>
        </form>
      )}
    </Layout>
  );
}

export function WeightsPage(props: { user: SessionUser; csrfToken: string; rubricId: string; batchName: string; learned: LearnedWeights; current: Record<string, number>; draft: string }) {
  const { learned } = props;
  return (
    <Layout title="Learned weights" user={props.user} csrfToken={props.csrfToken}>
      <p><a href="/stats">Back to statistics</a></p>
      <h1>{`Weights learned for ${props.rubricId}`}</h1>
      <p>{`From ${learned.pairs} decided pairs in "${props.batchName}". Held-out pairwise accuracy: present weights ${pct(learned.currentAccuracy)}; fitted weights ${pct(learned.fittedAccuracy)} (5-fold cross-validation). Model: P(a ≻ b) = σ(w · (f(a) − f(b))).`}</p>
      <table>
        <caption>Present and suggested weights (negative fitted weights become 0; the total is kept)</caption>
        <thead><tr><th scope="col">Criterion</th><th scope="col">Present</th><th scope="col">Suggested</th><th scope="col">Fitted (raw)</th></tr></thead>
        <tbody>{learned.criteria.map((id) => <tr><td>{id}</td><td>{props.current[id]}</td><td>{learned.suggested[id]}</td><td>{learned.raw[id]}</td></tr>)}</tbody>
      </table>
      <form method="post" action={`/rubrics/${props.rubricId}/draft`}>
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <input type="hidden" name="source" value={props.draft} />
        <button type="submit">Open as a draft in the rubric editor</button>
      </form>
      <p class="muted">The draft goes through the usual preview and publish; it is never applied by itself.</p>
    </Layout>
  );
}
