/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

export function NothingWaitingPage(props: { user: SessionUser; csrfToken: string }) {
  return (
    <Layout title="Nothing waiting" user={props.user} csrfToken={props.csrfToken}>
      <h1>Nothing waiting for you</h1>
      <p>Every open item has its reviewers, or you have reviewed it already. Take a break, or check back later.</p>
      <p><a href="/">Back to the queue</a></p>
    </Layout>
  );
}
