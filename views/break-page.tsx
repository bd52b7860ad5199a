/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

export function BreakPage(props: { user: SessionUser; csrfToken: string; today: number; limit: number }) {
  return (
    <Layout title="Time for a break?" user={props.user} csrfToken={props.csrfToken}>
      <h1>Time for a break?</h1>
      <p>{`You have reviewed ${props.today} items today; the suggested limit is ${props.limit}. Reading difficult material wears on anyone — a pause helps both you and the quality of the rankings.`}</p>
      <p>Follow your organisation's guidance on breaks and support. Skipping items never counts against you.</p>
      <p><a href="/">Back to the queue</a> · <a href="/review/next?continue=1">Continue reviewing anyway</a></p>
    </Layout>
  );
}
