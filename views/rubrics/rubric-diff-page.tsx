/** @jsxImportSource hono/jsx */
import type { DiffLine } from '../../src/rubric/line-diff.ts';
import type { SessionUser } from '../../src/web/context.ts';
import { Layout } from '../layout.tsx';

export function RubricDiffPage(props: { user: SessionUser; csrfToken: string; rubricId: string; from: string; to: string; lines: DiffLine[] }) {
  const changed = props.lines.filter((l) => l.kind !== 'same').length;
  return (
    <Layout title={`Compare ${props.from} with ${props.to}`} user={props.user} csrfToken={props.csrfToken}>
      <p><a href={`/rubrics/${props.rubricId}`}>{`Back to ${props.rubricId}`}</a></p>
      <h1>{`Changes from ${props.from} to ${props.to}`}</h1>
      <p>{changed ? `${changed} line(s) differ.` : 'The two versions have the same text.'}</p>
      <pre class="diff" aria-label="Line differences: lines starting with + were added, - removed">
        {props.lines.map((l) => (
          <div class={`diff-${l.kind}`}>{`${l.kind === 'added' ? '+' : l.kind === 'removed' ? '-' : ' '} ${l.text}`}</div>
        ))}
      </pre>
    </Layout>
  );
}
