/** @jsxImportSource hono/jsx */
import type { RubricSummary } from '../../src/store/repos/rubrics.ts';
import type { SessionUser } from '../../src/web/context.ts';
import { Layout } from '../layout.tsx';

export function RubricListPage(props: { user: SessionUser; csrfToken: string; rubrics: RubricSummary[] }) {
  return (
    <Layout title="Rubrics" user={props.user} csrfToken={props.csrfToken}>
      <h1>Rubrics</h1>
      <table>
        <caption>Rubrics in force: the newest published version, or the shipped file</caption>
        <thead><tr><th scope="col">Rubric</th><th scope="col">Id</th><th scope="col">Version</th><th scope="col">Criteria</th><th scope="col">Published versions</th></tr></thead>
        <tbody>
          {props.rubrics.map((r) => (
            <tr>
              <td><a href={`/rubrics/${r.id}`}>{r.title}</a></td>
              <td><code>{r.id}</code></td>
              <td><code>{r.version}</code></td>
              <td>{r.criteria}</td>
              <td>{r.published ? r.published : 'none (shipped file)'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </Layout>
  );
}
