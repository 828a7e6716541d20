import passport from 'passport';
import OpenIdConnect from 'passport-openidconnect';
import type { Sequelize } from 'sequelize';
import type { AuthConfig } from './auth-config';
import type { SessionUser } from './authorize';
import type { OidcProvider } from './oidc';
import { loadSessionUser, recordSignIn, rolesFromClaim } from './users';

export const STRATEGY = 'oidc';

/** What the strategy hands to `req.logIn`: the person's row id and the ID token (kept for sign-out). */
export interface VerifiedSignIn {
  readonly id: number;
  readonly idToken: string;
}


export interface SignIn {
  readonly passport: InstanceType<typeof passport.Authenticator>;
  /** Discovers the provider once and registers the strategy; rejects (503) while the provider is unreachable. */
  ready(): Promise<void>;
}

/**
 * passport with the OpenID Connect code flow (passport-openidconnect): confidential client, `state` and `nonce`
 * checked by the strategy; the ID token's signature checked here with jose; roles read from userinfo.
 */
export function createSignIn(sequelize: Sequelize, auth: AuthConfig, oidc: OidcProvider): SignIn {
  const authenticator = new passport.Authenticator();
  authenticator.serializeUser((user, done) => done(null, (user as SessionUser | VerifiedSignIn).id));
  authenticator.deserializeUser((id: number, done) => {
    loadSessionUser(sequelize, id).then((u) => done(null, u ?? false), done);
  });

  // The strategy passes userinfo only to a verify function that declares all nine parameters.
  function verify(
    issuer: string,
    uiProfile: object,
    idProfile: object,
    _context: object,
    idToken: string | object,
    _accessToken: string | object,
    _refreshToken: string,
    _params: unknown,
    done: OpenIdConnect.VerifyCallback,
  ): void {
    (async () => {
      let claims;
      try {
        if (typeof idToken !== 'string') throw new Error('no ID token');
        claims = await oidc.verifyIdToken(idToken);
      } catch (e) {
        console.warn(`[sign-in] ID token rejected: ${e instanceof Error ? e.message : String(e)}`);
        return done(null, false, { message: 'The identity provider’s answer could not be verified.' });
      }
      const userinfo = (uiProfile as { _json?: Record<string, unknown> } | undefined)?._json ?? {};
      // OpenID Connect Core §5.3.2: userinfo must be about the person the ID token names.
      if (userinfo['sub'] !== claims.sub || (idProfile as OpenIdConnect.Profile).id !== claims.sub) {
        return done(null, false, { message: 'The identity provider’s answers do not match.' });
      }
      const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v.trim() : undefined);
      const user = await recordSignIn(sequelize, {
        issuer,
        subject: claims.sub!,
        name: str(userinfo['name']) ?? str(userinfo['preferred_username']) ?? str(userinfo['email']) ?? claims.sub!,
        email: str(userinfo['email']) ?? '',
        idpRoles: rolesFromClaim(userinfo[auth.rolesClaim] ?? claims[auth.rolesClaim]),
      });
      const signedIn: VerifiedSignIn = { id: user.id, idToken: idToken as string };
      done(null, signedIn);
    })().catch((e: unknown) => done(e instanceof Error ? e : new Error(String(e))));
  }

  let registered: Promise<void> | undefined;
  return {
    passport: authenticator,
    ready() {
      registered ??= oidc.discover().then(
        (meta) => {
          authenticator.use(
            STRATEGY,
            new OpenIdConnect.Strategy(
              {
                issuer: auth.issuer,
                authorizationURL: meta.authorization_endpoint,
                tokenURL: meta.token_endpoint,
                userInfoURL: meta.userinfo_endpoint,
                clientID: auth.clientId,
                clientSecret: auth.clientSecret,
                callbackURL: auth.redirectUri,
                scope: auth.scope.split(/\s+/).filter((s) => s && s !== 'openid'),
                // Any truthy value makes the strategy send a fresh nonce and check it in the ID token.
                nonce: 'true',
                sessionKey: 'oidc',
              },
              verify,
            ),
          );
        },
        (e: unknown) => {
          registered = undefined;
          throw e;
        },
      );
      return registered;
    },
  };
}
