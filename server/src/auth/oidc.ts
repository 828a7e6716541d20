import { createRemoteJWKSet, jwtVerify, type JWTPayload, type JWTVerifyGetKey } from 'jose';
import { AppError } from '../errors';
import type { AuthConfig } from './auth-config';

/** The parts of the provider's discovery document the app uses. */
export interface ProviderMetadata {
  readonly issuer: string;
  readonly authorization_endpoint: string;
  readonly token_endpoint: string;
  readonly userinfo_endpoint: string;
  readonly jwks_uri: string;
  readonly end_session_endpoint?: string;
  readonly id_token_signing_alg_values_supported?: readonly string[];
}

const ASYMMETRIC = /^(RS|PS|ES)(256|384|512)$|^EdDSA$/;

/**
 * What the app knows about its OpenID provider: discovery (fetched on first use and cached; retried after a
 * failure), the provider's signing keys (jose's remote JWK set, refreshed on an unknown `kid`), ID-token
 * verification, and the end-session URL.
 */
export class OidcProvider {
  private metadata?: Promise<ProviderMetadata>;
  private keys?: JWTVerifyGetKey;

  constructor(private readonly config: AuthConfig) {}

  discover(): Promise<ProviderMetadata> {
    this.metadata ??= this.fetchMetadata().catch((e: unknown) => {
      this.metadata = undefined;
      throw e;
    });
    return this.metadata;
  }

  private async fetchMetadata(): Promise<ProviderMetadata> {
    const url = `${this.config.issuer.replace(/\/$/, '')}/.well-known/openid-configuration`;
    let res: Response;
    try {
      res = await fetch(url, { signal: AbortSignal.timeout(5000), headers: { accept: 'application/json' } });
    } catch (e) {
      throw new AppError(503, 'idp-unavailable', 'The sign-in service cannot be reached right now. Try again in a minute.', {
        cause: e instanceof Error ? e.message : String(e),
      });
    }
    if (!res.ok) {
      throw new AppError(503, 'idp-unavailable', `The sign-in service answered ${res.status} to discovery.`);
    }
    const meta = (await res.json()) as ProviderMetadata;
    // OpenID Connect Discovery 1.0 §4.3: the issuer in the document must equal the one we asked.
    if (meta.issuer !== this.config.issuer) {
      throw new AppError(503, 'idp-misconfigured', `The provider calls itself "${meta.issuer}", not "${this.config.issuer}".`);
    }
    for (const key of ['authorization_endpoint', 'token_endpoint', 'userinfo_endpoint', 'jwks_uri'] as const) {
      if (typeof meta[key] !== 'string') throw new AppError(503, 'idp-misconfigured', `The provider publishes no ${key}.`);
    }
    this.keys = createRemoteJWKSet(new URL(meta.jwks_uri), { timeoutDuration: 5000 });
    return meta;
  }

  /**
   * Verifies the ID token's signature against the provider's published keys, and its issuer, audience and
   * lifetime — defence in depth: passport-openidconnect 0.1.2 decodes the token without checking the signature.
   */
  async verifyIdToken(idToken: string): Promise<JWTPayload> {
    const meta = await this.discover();
    const algorithms = (meta.id_token_signing_alg_values_supported ?? ['RS256']).filter((a) => ASYMMETRIC.test(a));
    const { payload } = await jwtVerify(idToken, this.keys!, {
      issuer: this.config.issuer,
      audience: this.config.clientId,
      algorithms,
      clockTolerance: 30,
      requiredClaims: ['sub', 'iat', 'exp'],
    });
    return payload;
  }

  /** RP-initiated logout at the provider, or `null` when it offers none. */
  async endSessionUrl(idTokenHint: string | undefined): Promise<string | null> {
    const meta = await this.discover().catch(() => undefined);
    if (!meta?.end_session_endpoint) return null;
    const url = new URL(meta.end_session_endpoint);
    if (idTokenHint) url.searchParams.set('id_token_hint', idTokenHint);
    url.searchParams.set('client_id', this.config.clientId);
    url.searchParams.set('post_logout_redirect_uri', this.config.postLogoutRedirectUri);
    return url.toString();
  }
}
