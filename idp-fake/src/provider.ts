import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import Provider, { errors, type Configuration, type Grant, type KoaContextWithOIDC } from 'oidc-provider';
import type { DemoAccount } from './accounts';
import { loginPage, logoutPage, messagePage, type Page } from './pages';
import type { ProviderKeys } from './state';

export interface IdpOptions {
  /** Address to listen on; loopback by default. */
  readonly host?: string;
  /** Port; 0 picks a free one (tests). */
  readonly port: number;
  /** Issuer identifier; defaults to `http://host:port` once listening. Must match the app's setting exactly. */
  readonly issuer?: string;
  readonly clientId: string;
  readonly clientSecret: string;
  /** Public URLs of the app: callbacks are `<url>/auth/callback`, sign-out returns to `<url>/`. */
  readonly appUrls: readonly string[];
  readonly accounts: readonly DemoAccount[];
  readonly keys: ProviderKeys;
}

export interface RunningIdp {
  readonly issuer: string;
  readonly port: number;
  readonly server: Server;
  close(): Promise<void>;
}

/** The scopes and the claims each one releases; `roles` carries Wickwright's roles. */
const CLAIMS: Record<string, string[]> = {
  openid: ['sub'],
  profile: ['name', 'preferred_username'],
  email: ['email', 'email_verified'],
  roles: ['roles'],
};
const FIRST_PARTY_SCOPE = Object.keys(CLAIMS).join(' ');

/**
 * Starts a local OpenID Connect provider (oidc-provider) for one confidential, first-party client: code flow,
 * our own sign-in page listing the demo accounts, consent skipped, RP-initiated logout.
 */
export async function startIdp(options: IdpOptions): Promise<RunningIdp> {
  let handle: (req: IncomingMessage, res: ServerResponse) => void = (_req, res) => {
    res.statusCode = 503;
    res.end();
  };
  const server = createServer((req, res) => handle(req, res));
  await new Promise<void>((resolveListen, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolveListen());
  });
  const port = (server.address() as AddressInfo).port;
  const issuer = options.issuer ?? `http://${options.host ?? '127.0.0.1'}:${port}`;

  const provider = buildProvider(issuer, options);
  const oidc = provider.callback();
  handle = (req, res) => {
    const path = new URL(req.url ?? '/', issuer).pathname;
    if (path.startsWith('/interaction/')) {
      interactions(provider, options, req, res, path).catch((e: unknown) => {
        const gone = e instanceof errors.SessionNotFound;
        if (!gone) console.error('[idp] interaction failed:', e);
        send(
          res,
          gone ? 400 : 500,
          messagePage(
            gone ? 'This sign-in has expired' : 'Sign-in failed',
            gone
              ? 'The sign-in page was open too long or was already used. Go back to Wickwright and choose Sign in again.'
              : 'Something went wrong at the identity provider. Go back to Wickwright and try again.',
          ),
        );
      });
      return;
    }
    oidc(req, res);
  };

  return {
    issuer,
    port,
    server,
    close: () =>
      new Promise<void>((r) => {
        server.closeAllConnections();
        server.close(() => r());
      }),
  };
}

function appOrigins(options: IdpOptions): string[] {
  return [...new Set(options.appUrls.map((u) => new URL(u).origin))];
}

function buildProvider(issuer: string, options: IdpOptions): Provider {
  const byId = new Map(options.accounts.map((a) => [a.sub, a]));
  const origins = appOrigins(options);
  const config: Configuration = {
    clients: [
      {
        client_id: options.clientId,
        client_secret: options.clientSecret,
        client_name: 'Wickwright',
        redirect_uris: options.appUrls.map((u) => `${u.replace(/\/$/, '')}/auth/callback`),
        post_logout_redirect_uris: options.appUrls.map((u) => `${u.replace(/\/$/, '')}/`),
        grant_types: ['authorization_code'],
        response_types: ['code'],
        // passport-openidconnect sends the secret in the token request body.
        token_endpoint_auth_method: 'client_secret_post',
      },
    ],
    jwks: options.keys.jwks,
    cookies: { keys: options.keys.cookieKeys },
    claims: CLAIMS,
    responseTypes: ['code'],
    findAccount: (_ctx, sub) => {
      const a = byId.get(sub);
      if (!a) return undefined;
      return {
        accountId: a.sub,
        claims: () => ({
          sub: a.sub,
          name: a.name,
          preferred_username: a.username,
          email: a.email,
          email_verified: true,
          roles: [...a.roles],
        }),
      };
    },
    // Wickwright is the company's own application: no consent screen. A grant covering the requested scopes
    // is created (or widened) here, so the consent prompt never fires.
    loadExistingGrant: async (ctx: KoaContextWithOIDC): Promise<Grant | undefined> => {
      const { client, session, result, provider } = ctx.oidc;
      if (!client || !session?.accountId) return undefined;
      const grantId = result?.consent?.grantId ?? session.grantIdFor(client.clientId);
      const existing = grantId ? await provider.Grant.find(grantId) : undefined;
      if (client.clientId !== options.clientId) return existing;
      const grant = existing ?? new provider.Grant({ clientId: client.clientId, accountId: session.accountId });
      const requested = ctx.oidc.requestParamScopes ? [...ctx.oidc.requestParamScopes].join(' ') : FIRST_PARTY_SCOPE;
      grant.addOIDCScope(requested);
      await grant.save();
      return grant;
    },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    features: {
      devInteractions: { enabled: false },
      rpInitiatedLogout: {
        enabled: true,
        logoutSource: async (ctx: KoaContextWithOIDC, form: string) => {
          render(ctx, logoutPage(form, ctx.oidc.client?.clientName, origins));
        },
        postLogoutSuccessSource: async (ctx: KoaContextWithOIDC) => {
          render(ctx, messagePage('Signed out', 'You are signed out of Brightwell sign-on. You can close this page.'));
        },
      },
    },
    // No PKCE from passport-openidconnect 0.1.2: allowed for this confidential client only (the default rule).
    pkce: { required: (_ctx, client) => (client as { clientAuthMethod?: string }).clientAuthMethod === 'none' },
    clientBasedCORS: () => false,
    ttl: {
      AccessToken: 10 * 60,
      AuthorizationCode: 60,
      IdToken: 10 * 60,
      Interaction: 15 * 60,
      Session: 10 * 60 * 60,
      Grant: 10 * 60 * 60,
    },
    renderError: (ctx, out) => {
      render(ctx, messagePage('Sign-in problem', `${out['error'] ?? 'error'}: ${out['error_description'] ?? ''}`));
    },
  };
  const provider = new Provider(issuer, config);
  provider.proxy = false;
  return provider;
}

function render(ctx: KoaContextWithOIDC, page: Page): void {
  ctx.type = 'html';
  ctx.set('Content-Security-Policy', page.csp);
  ctx.set('Cache-Control', 'no-store');
  ctx.body = page.html;
}

function send(res: ServerResponse, status: number, page: Page): void {
  if (res.headersSent) {
    res.end();
    return;
  }
  res.statusCode = status;
  res.setHeader('Content-Type', 'text/html; charset=utf-8');
  res.setHeader('Content-Security-Policy', page.csp);
  res.setHeader('Cache-Control', 'no-store');
  res.end(page.html);
}

async function readForm(req: IncomingMessage): Promise<URLSearchParams> {
  let body = '';
  for await (const chunk of req) {
    body += String(chunk);
    if (body.length > 10_000) throw new Error('form too large');
  }
  return new URLSearchParams(body);
}

/** Our own interaction screens: `GET /interaction/:uid`, `POST …/login`, `GET …/abort`. */
async function interactions(
  provider: Provider,
  options: IdpOptions,
  req: IncomingMessage,
  res: ServerResponse,
  path: string,
): Promise<void> {
  const [, , uid, step] = path.split('/');
  const details = await provider.interactionDetails(req, res);
  if (details.uid !== uid) throw new errors.SessionNotFound('interaction mismatch');
  const formTargets = appOrigins(options);
  const loginInput = { uid: details.uid, clientName: 'Wickwright', accounts: options.accounts, formTargets };

  if (req.method === 'GET' && step === undefined) {
    if (details.prompt.name === 'login') return send(res, 200, loginPage(loginInput));
    // Consent is skipped by loadExistingGrant; anything else left over is granted for the first-party client.
    const grant = new provider.Grant({ clientId: options.clientId, accountId: details.session?.accountId ?? '' });
    grant.addOIDCScope(FIRST_PARTY_SCOPE);
    const grantId = await grant.save();
    return provider.interactionFinished(req, res, { consent: { grantId } }, { mergeWithLastSubmission: true });
  }
  if (req.method === 'POST' && step === 'login') {
    const form = await readForm(req);
    const username = (form.get('username') ?? '').trim().toLowerCase();
    const account = options.accounts.find((a) => a.username === username);
    if (!account || account.password !== form.get('password')) {
      return send(res, 401, loginPage({ ...loginInput, username, error: 'Unknown username or wrong password.' }));
    }
    return provider.interactionFinished(req, res, { login: { accountId: account.sub } }, { mergeWithLastSubmission: false });
  }
  if (req.method === 'GET' && step === 'abort') {
    return provider.interactionFinished(
      req,
      res,
      { error: 'access_denied', error_description: 'The sign-in was cancelled.' },
      { mergeWithLastSubmission: false },
    );
  }
  res.statusCode = 404;
  res.end();
}
