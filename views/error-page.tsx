/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import { Layout } from './layout.tsx';

const TITLES: Record<number, string> = {
  400: 'Bad request',
  401: 'Please sign in',
  403: 'Not allowed',
  404: 'Not found',
  409: 'Conflict',
  413: 'Too large',
  422: 'Check the form',
  429: 'Too many attempts',
  500: 'Something went wrong',
  503: 'Database unavailable',
};

/** The one error fragment: used alone for htmx requests and inside the page frame otherwise. */
export function ErrorFragment({ status, message }: { status: number; message: string }) {
  return (
    <div class="error-box" role="alert">
      <h2>{TITLES[status] ?? 'Error'}</h2>
      <p>{message}</p>
    </div>
  );
}

export function ErrorPage(props: { status: number; message: string; user: SessionUser | null; csrfToken: string }) {
  return (
    <Layout title={TITLES[props.status] ?? 'Error'} user={props.user} csrfToken={props.csrfToken}>
      <ErrorFragment status={props.status} message={props.message} />
      <p><a href="/">Back to the queue</a></p>
    </Layout>
  );
}
