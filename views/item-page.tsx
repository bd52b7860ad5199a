/** @jsxImportSource hono/jsx */
import type { Item, ResponseRow } from '../src/store/schema.ts';
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';
import { UntrustedText } from './text.tsx';

export function ItemPage(props: { user: SessionUser; csrfToken: string; item: Item; batchName: string; responses: ResponseRow[] }) {
  const { item } = props;
  return (
    <Layout title={`Item ${item.prompt_id}`} user={props.user} csrfToken={props.csrfToken}>
      <p class="muted">{`${props.batchName} · ${item.prompt_id}`}</p>
      <h1>Prompt</h1>
      <UntrustedText class="prompt" text={item.prompt} />
      {item.flag_reason && <p class="flag">Flag: {item.flag_reason} ({item.flag_severity})</p>}
      <h2>{`Candidates (${props.responses.length})`}</h2>
      <ol class="candidates">
        {props.responses.map((r) => (
          <li>
            <h3>{`Candidate ${r.response_id}`}</h3>
            <UntrustedText text={r.text} />
          </li>
        ))}
      </ol>
    </Layout>
  );
}
