// oidc-provider ships no type declarations; this covers the small part of its API the fake uses.
declare module 'oidc-provider' {
  import type { IncomingMessage, ServerResponse } from 'node:http';

  export interface OidcContext {
    readonly client?: { readonly clientId: string; readonly clientName?: string };
    readonly session?: { readonly accountId?: string; grantIdFor(clientId: string): string | undefined };
    readonly result?: { readonly consent?: { readonly grantId?: string } };
    readonly params?: Record<string, unknown>;
    readonly requestParamScopes?: Set<string>;
    readonly provider: Provider;
  }

  /** The Koa context the provider hands to its hooks. */
  export interface KoaContextWithOIDC {
    readonly oidc: OidcContext;
    readonly host: string;
    body: unknown;
    type: string;
    status: number;
    set(field: string, value: string): void;
  }

  export interface Account {
    readonly accountId: string;
    claims(use: string, scope: string): Promise<Record<string, unknown>> | Record<string, unknown>;
  }

  export interface Grant {
    readonly jti: string;
    addOIDCScope(scope: string): void;
    addOIDCClaims(claims: string[]): void;
    save(): Promise<string>;
  }

  export interface Interaction {
    readonly uid: string;
    readonly prompt: { readonly name: string; readonly details: Record<string, unknown> };
    readonly params: Record<string, unknown>;
    readonly session?: { readonly accountId?: string };
    readonly grantId?: string;
  }

  export interface InteractionResults {
    login?: { accountId: string };
    consent?: { grantId: string };
    error?: string;
    error_description?: string;
  }

  export interface ClientMetadata {
    client_id: string;
    client_secret?: string;
    client_name?: string;
    redirect_uris: string[];
    post_logout_redirect_uris?: string[];
    grant_types?: string[];
    response_types?: string[];
    token_endpoint_auth_method?: string;
  }

  export interface Configuration {
    clients?: ClientMetadata[];
    jwks?: { keys: Record<string, unknown>[] };
    cookies?: { keys?: string[]; names?: Record<string, string> };
    claims?: Record<string, string[]>;
    scopes?: string[];
    findAccount?: (ctx: KoaContextWithOIDC, id: string) => Promise<Account | undefined> | Account | undefined;
    loadExistingGrant?: (ctx: KoaContextWithOIDC) => Promise<Grant | undefined>;
    interactions?: { url?: (ctx: KoaContextWithOIDC, interaction: Interaction) => string | Promise<string> };
    features?: Record<string, unknown>;
    pkce?: { required?: (ctx: KoaContextWithOIDC, client: unknown) => boolean };
    ttl?: Record<string, number | ((...args: unknown[]) => number)>;
    renderError?: (ctx: KoaContextWithOIDC, out: Record<string, string>, error: Error) => Promise<void> | void;
    clientBasedCORS?: (ctx: KoaContextWithOIDC, origin: string, client: unknown) => boolean;
    responseTypes?: string[];
  }

  export default class Provider {
    constructor(issuer: string, configuration?: Configuration);
    readonly issuer: string;
    proxy: boolean;
    readonly Grant: {
      new (init: { clientId: string; accountId: string }): Grant;
      find(id: string): Promise<Grant | undefined>;
    };
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    interactionDetails(req: IncomingMessage, res: ServerResponse): Promise<Interaction>;
    interactionFinished(
      req: IncomingMessage,
      res: ServerResponse,
      result: InteractionResults,
      options?: { mergeWithLastSubmission?: boolean },
    ): Promise<void>;
    on(event: string, listener: (...args: unknown[]) => void): this;
  }

  export const errors: { readonly SessionNotFound: new (...args: unknown[]) => Error };
}
