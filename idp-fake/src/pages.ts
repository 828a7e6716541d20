import { randomBytes } from 'node:crypto';
import type { DemoAccount } from './accounts';

/** Escapes text for HTML element content and double-quoted attributes. */
export function esc(value: unknown): string {
  return String(value ?? '').replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

export interface Page {
  readonly html: string;
  /** Content-Security-Policy for this page: nothing but its own nonce'd style (and script), forms to `formTargets`. */
  readonly csp: string;
}

const STYLE = `
  :root { color-scheme: light; --ink: #1d2b36; --muted: #55636e; --line: #d5dde3; --brand: #0f6b74; --brand-ink: #fff; --bad: #a4262c; }
  * { box-sizing: border-box; }
  body { margin: 0; font: 15px/1.45 system-ui, sans-serif; color: var(--ink); background: #eef3f5; }
  header { background: var(--brand); color: var(--brand-ink); padding: 14px 24px; font-weight: 600; letter-spacing: .02em; }
  header small { font-weight: 400; opacity: .85; margin-left: 8px; }
  main { max-width: 720px; margin: 32px auto; padding: 0 16px; }
  .card { background: #fff; border: 1px solid var(--line); border-radius: 12px; padding: 24px; margin-bottom: 20px; }
  h1 { font-size: 1.4rem; margin: 0 0 4px; }
  p { margin: 0 0 12px; color: var(--muted); }
  label { display: block; font-weight: 600; margin: 12px 0 4px; }
  input[type=text], input[type=password] { width: 100%; padding: 10px 12px; border: 1px solid var(--line); border-radius: 8px; font: inherit; }
  .actions { display: flex; gap: 12px; align-items: center; margin-top: 16px; }
  button { font: inherit; font-weight: 600; padding: 9px 18px; border-radius: 20px; border: 0; background: var(--brand); color: var(--brand-ink); cursor: pointer; }
  button.quiet { background: transparent; color: var(--brand); border: 1px solid var(--line); padding: 5px 12px; font-weight: 500; }
  a { color: var(--brand); }
  .error { color: var(--bad); font-weight: 600; }
  table { width: 100%; border-collapse: collapse; }
  th, td { text-align: left; padding: 8px 6px; border-top: 1px solid var(--line); vertical-align: middle; }
  th { font-size: .85rem; color: var(--muted); font-weight: 600; border-top: 0; }
  td form { margin: 0; }
  .role { display: inline-block; font-size: .8rem; padding: 1px 8px; margin: 1px 2px 1px 0; border-radius: 10px; background: #e2eff0; }
  code { background: #e2eff0; padding: 1px 6px; border-radius: 4px; }
`;

function page(title: string, body: string, formTargets: readonly string[], script = ''): Page {
  const nonce = randomBytes(16).toString('base64');
  const html = `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <meta name="viewport" content="width=device-width, initial-scale=1">
  <title>${esc(title)} · Brightwell sign-on (demo)</title>
  <style nonce="${nonce}">${STYLE}</style>
</head>
<body>
  <header>Brightwell Hygiene Ltd. sign-on <small>demo identity provider — invented company, invented people</small></header>
  <main>${body}</main>
  ${script ? `<script nonce="${nonce}">${script}</script>` : ''}
</body>
</html>`;
  const csp = [
    "default-src 'none'",
    `style-src 'nonce-${nonce}'`,
    `script-src 'nonce-${nonce}'`,
    // Browsers check form-action along the redirect chain too: the login form ends at the app's callback.
    `form-action 'self' ${formTargets.join(' ')}`.trim(),
    "frame-ancestors 'none'",
    "base-uri 'none'",
  ].join('; ');
  return { html, csp };
}

export interface LoginPageInput {
  readonly uid: string;
  readonly clientName: string;
  readonly accounts: readonly DemoAccount[];
  readonly username?: string;
  readonly error?: string;
  readonly formTargets: readonly string[];
}

/** The sign-in screen: a username/password form and the demo accounts, each with a one-click button. */
export function loginPage({ uid, clientName, accounts, username, error, formTargets }: LoginPageInput): Page {
  const action = `/interaction/${encodeURIComponent(uid)}/login`;
  const passwords = [...new Set(accounts.map((a) => a.password))];
  const rows = accounts
    .map(
      (a) => `<tr>
        <td><strong>${esc(a.name)}</strong><br><small>${esc(a.title ?? '')}</small></td>
        <td><code>${esc(a.username)}</code></td>
        <td>${a.roles.map((r) => `<span class="role">${esc(r)}</span>`).join('') || '<small>no Wickwright role</small>'}</td>
        <td><form method="post" action="${action}">
          <input type="hidden" name="username" value="${esc(a.username)}">
          <input type="hidden" name="password" value="${esc(a.password)}">
          <button class="quiet" type="submit" aria-label="Sign in as ${esc(a.name)}">Use</button>
        </form></td>
      </tr>`,
    )
    .join('');
  return page(
    'Sign in',
    `<section class="card">
      <h1>Sign in</h1>
      <p><strong>${esc(clientName)}</strong> asks you to sign in with your Brightwell account.</p>
      ${error ? `<p class="error" role="alert">${esc(error)}</p>` : ''}
      <form method="post" action="${action}" autocomplete="off">
        <label for="username">Username</label>
        <input id="username" name="username" type="text" value="${esc(username ?? '')}" required autofocus>
        <label for="password">Password</label>
        <input id="password" name="password" type="password" required>
        <div class="actions">
          <button type="submit">Sign in</button>
          <a href="/interaction/${encodeURIComponent(uid)}/abort">Cancel</a>
        </div>
      </form>
    </section>
    <section class="card" aria-labelledby="demo-accounts">
      <h1 id="demo-accounts">Demo accounts</h1>
      <p>Invented people of the fictional Brightwell Hygiene Ltd. Password for all:
        ${passwords.map((p) => `<code>${esc(p)}</code>`).join(', ')}.</p>
      <table>
        <thead><tr><th>Person</th><th>Username</th><th>Wickwright roles</th><th></th></tr></thead>
        <tbody>${rows}</tbody>
      </table>
    </section>`,
    formTargets,
  );
}

/** Sign-out: the provider's confirmation form, submitted at once (the person already chose "Sign out" in the app). */
export function logoutPage(form: string, clientName: string | undefined, formTargets: readonly string[]): Page {
  return page(
    'Signing out',
    `<section class="card">
      <h1>Signing out</h1>
      <p>Ending your Brightwell sign-on session${clientName ? ` and returning to <strong>${esc(clientName)}</strong>` : ''}…</p>
      ${form}
      <input type="hidden" name="logout" value="yes" form="op.logoutForm">
      <div class="actions"><button type="submit" form="op.logoutForm">Continue</button></div>
    </section>`,
    formTargets,
    `document.getElementById('op.logoutForm').submit();`,
  );
}

export function messagePage(title: string, message: string, formTargets: readonly string[] = []): Page {
  return page(title, `<section class="card"><h1>${esc(title)}</h1><p>${esc(message)}</p></section>`, formTargets);
}
