/** @jsxImportSource hono/jsx */
import type { User } from '../src/store/schema.ts';
import type { SessionUser } from '../src/web/context.ts';
import { ROLES } from '../src/auth/roles.ts';
import { Layout } from './layout.tsx';

export function UsersPage(props: { user: SessionUser; csrfToken: string; users: User[]; shown?: { username: string; password: string }; error?: string }) {
  return (
    <Layout title="Users" user={props.user} csrfToken={props.csrfToken}>
      <h1>Users</h1>
      {props.shown && (
        <div class="notice" role="status">
          <p>{`Password for ${props.shown.username} — shown this once; pass it on privately:`}</p>
          <p><code class="token">{props.shown.password}</code></p>
        </div>
      )}
      {props.error && <div class="error-box" role="alert">{props.error}</div>}
      <table>
        <caption>Accounts and their roles</caption>
        <thead><tr><th scope="col">User name</th><th scope="col">Name</th><th scope="col">Roles</th><th scope="col">State</th><th scope="col">Actions</th></tr></thead>
        <tbody>
          {props.users.map((u) => (
            <tr>
              <td>{u.username}</td>
              <td>{u.display_name}</td>
              <td>{u.roles.replace(/,/g, ', ')}</td>
              <td>{u.disabled ? 'disabled' : 'active'}</td>
              <td class="actions">
                <form method="post" action={`/admin/users/${u.id}/reset-password`}>
                  <input type="hidden" name="_csrf" value={props.csrfToken} />
                  <button type="submit" aria-label={`Reset password of ${u.username}`}>Reset password</button>
                </form>
                {!u.disabled && u.id !== props.user.id && (
                  <form method="post" action={`/admin/users/${u.id}/disable`}>
                    <input type="hidden" name="_csrf" value={props.csrfToken} />
                    <button type="submit" aria-label={`Disable ${u.username}`}>Disable</button>
                  </form>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <h2>Add a user</h2>
      <form method="post" action="/admin/users">
        <input type="hidden" name="_csrf" value={props.csrfToken} />
        <label for="username">User name</label>
        <input id="username" name="username" required pattern="[a-z0-9][a-z0-9._\-]{1,39}" />
        <label for="display_name">Name shown to others</label>
        <input id="display_name" name="display_name" maxlength={80} />
        <fieldset>
          <legend>Roles</legend>
          {ROLES.map((r) => <label><input type="checkbox" name="roles" value={r} />{` ${r}`}</label>)}
        </fieldset>
        <button type="submit">Add user</button>
      </form>
    </Layout>
  );
}
