/** @jsxImportSource hono/jsx */
import type { Rubric } from '../../src/rubric/load.ts';
import type { RubricVersionRow } from '../../src/store/repos/rubrics.ts';
import type { SessionUser } from '../../src/web/context.ts';
import { hasAnyRole } from '../../src/auth/roles.ts';
import { Layout } from '../layout.tsx';

export function RubricPage(props: { user: SessionUser; csrfToken: string; rubric: Rubric; versions: RubricVersionRow[] }) {
  const { rubric, versions } = props;
  return (
    <Layout title={rubric.title} user={props.user} csrfToken={props.csrfToken}>
      <p class="muted"><code>{rubric.id}</code> · version <code>{rubric.version}</code></p>
      <h1>{rubric.title}</h1>
      {rubric.description && <p>{rubric.description}</p>}
      {hasAnyRole(props.user.roles, ['policy']) && <p><a class="button" href={`/rubrics/${rubric.id}/edit`}>Edit a draft</a></p>}
      <table>
        <caption>{`Criteria — overall bands: pass at ${rubric.overallBands.pass}, review at ${rubric.overallBands.review}`}</caption>
        <thead><tr><th scope="col">Criterion</th><th scope="col">Check</th><th scope="col">Weight</th><th scope="col">Severity</th><th scope="col">Bands (pass / review)</th><th scope="col">Parameters set</th></tr></thead>
        <tbody>
          {rubric.criteria.map((c) => (
            <tr>
              <td><code>{c.id}</code>{c.description && <div class="muted">{c.description}</div>}</td>
              <td>{c.check}</td>
              <td>{c.weight}</td>
              <td><span class={`sev sev-${c.severity === 'warn' ? 'medium' : c.severity === 'error' ? 'high' : c.severity === 'critical' ? 'critical' : 'low'}`}>{c.severity}</span></td>
              <td>{`${c.bands.pass} / ${c.bands.review}`}</td>
              <td>{Object.keys(c.params).join(', ') || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <h2>History</h2>
      {versions.length === 0 ? (
        <p class="empty">Not published yet: the shipped file is in force.</p>
      ) : (
        <form method="get" action={`/rubrics/${rubric.id}/diff`} class="history">
          <table>
            <caption>Published versions, newest first — pick two to compare</caption>
            <thead><tr><th scope="col">From</th><th scope="col">To</th><th scope="col">Version</th><th scope="col">Published</th><th scope="col">By</th><th scope="col">Note</th></tr></thead>
            <tbody>
              {versions.map((v, i) => (
                <tr>
                  <td><input type="radio" name="from" value={v.version} checked={i === 1} aria-label={`compare from ${v.version}`} /></td>
                  <td><input type="radio" name="to" value={v.version} checked={i === 0} aria-label={`compare to ${v.version}`} /></td>
                  <td><code>{v.version}</code></td>
                  <td>{v.created_at.slice(0, 16).replace('T', ' ')}</td>
                  <td>{v.author ?? '—'}</td>
                  <td>{v.note ?? ''}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {versions.length > 1 && <button type="submit">Compare</button>}
        </form>
      )}
      <h2>File</h2>
      <pre class="source">{rubric.source}</pre>
    </Layout>
  );
}
