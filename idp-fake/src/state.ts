import { generateKeyPairSync, randomBytes, randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The git-ignored state folder shared with the app (`WICK_STATE_DIR`, default `.wick/` at the repository root). */
export function stateDir(): string {
  return process.env['WICK_STATE_DIR'] ?? resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '.wick');
}

function readOrCreate(file: string, create: () => string): string {
  if (existsSync(file)) return readFileSync(file, 'utf8');
  mkdirSync(dirname(file), { recursive: true });
  const text = create();
  // 0600: keys and secrets are readable by the owner only.
  writeFileSync(file, text, { mode: 0o600 });
  return text;
}

/**
 * The client secret the provider expects from Wickwright. Either `WICK_OIDC_CLIENT_SECRET`, or the file
 * `oidc-client-secret` in the state folder, which the app reads too (whichever process starts first writes it).
 */
export function clientSecret(dir = stateDir()): string {
  const fromEnv = process.env['WICK_OIDC_CLIENT_SECRET'];
  if (fromEnv) return fromEnv;
  return readOrCreate(join(dir, 'oidc-client-secret'), () => randomBytes(32).toString('base64url') + '\n').trim();
}

export interface ProviderKeys {
  /** Private signing keys as JWK (RS256); the provider publishes the public halves at its jwks_uri. */
  readonly jwks: { keys: Record<string, unknown>[] };
  /** Keys that sign the provider's own cookies. */
  readonly cookieKeys: string[];
}

/** Signing keys, generated at first start and kept in `idp-keys.json` in the state folder (never committed). */
export function providerKeys(dir = stateDir()): ProviderKeys {
  const text = readOrCreate(join(dir, 'idp-keys.json'), () => {
    const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
    const jwk = { ...privateKey.export({ format: 'jwk' }), kid: randomUUID(), alg: 'RS256', use: 'sig' };
    const keys: ProviderKeys = { jwks: { keys: [jwk] }, cookieKeys: [randomBytes(32).toString('base64url')] };
    return JSON.stringify(keys, null, 2) + '\n';
  });
  return JSON.parse(text) as ProviderKeys;
}
