/** @jsxImportSource hono/jsx */
import type { SessionUser } from '../src/web/context.ts';
import { TOKEN_SCOPES } from '../src/store/repos/api-tokens.ts';
import { Layout } from './layout.tsx';

interface TokenRow {
  id: number;
  name: string;
  scopes: string;
  created_at: string;
  revoked_at: string | null;
  last_used_at: string | null;
}

export function TokensPage(props: { user: SessionUser; csrfToken: string; tokens: TokenRow[]; created?: { name: string; token: string }; error?: string }) {
  return (
    <Layout title="API tokens" user={props.user} csrfToken={props.csrfToken}>
      <h1>API tokens</h1>
      {props.created && (
        <div class="notice" role="status">
          <p>{`Token "${props.created.name}" — copy it now; it is stored only as a hash and will not be shown again:`}</p>
          <p><code class="token">{props.created.token}</code></p>
        </div>
      )}
      {props.error && <div class="error-box" role="alert">{props.error}</div>}
      <form method="post" action="/admin/tokens">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <label for="name">Name (who or what uses it)</label>
        <input id="name" name="name" required maxlength={80} />
        <fieldset>
          <legend>Scopes</legend>
          {TOKEN_SCOPES.map((s) => (
            <label><input type="checkbox" name="scopes" value={s} />{` ${s}`}</label>
          ))}
        </fieldset>
        <button type="submit">Create token</button>
      </form>
      <table>
        <caption>Tokens, newest first</caption>
        <thead><tr><th scope="col">Name</th><th scope="col">Scopes</th><th scope="col">Created</th><th scope="col">Last used</th><th scope="col">State</th></tr></thead>
        <tbody>
          {props.tokens.map((t) => (
            <tr>
              <td>{t.name}</td>
              <td>{t.scopes}</td>
              <td>{t.created_at.slice(0, 16).replace('T', ' ')}</td>
              <td>{t.last_used_at ? t.last_used_at.slice(0, 16).replace('T', ' ') : 'never'}</td>
              <td>
                {t.revoked_at ? (
                  `revoked ${t.revoked_at.slice(0, 10)}`
                ) : (
                  <form method="post" action={`/admin/tokens/${t.id}/revoke`}>
                    <input type="hidden" name="_csrf" value={props.csrfToken} />
                    <button type="submit" aria-label={`Revoke token ${t.name}`}>Revoke</button>
                  </form>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Layout>
  );
}
