/** @jsxImportSource hono/jsx */
import { Layout } from './layout.tsx';

export function LoginPage(props: { csrfToken: string; next: string; error?: string; username?: string }) {
  return (
    <Layout title="Sign in" user={null} csrfToken={props.csrfToken}>
      <section class="login">
        <h1>Sign in</h1>
        {props.error && <p class="error-box" role="alert">{props.error}</p>}
        <form method="post" action="/login">
          <input type="hidden" name="_csrf" value={props.csrfToken} />
          <input type="hidden" name="next" value={props.next} />
          <label for="username">User name</label>
          <input id="username" name="username" autocomplete="username" required value={props.username ?? ''} />
          <label for="password">Password</label>
          <input id="password" name="password" type="password" autocomplete="current-password" required />
          <button type="submit">Sign in</button>
        </form>
      </section>
    </Layout>
  );
}
