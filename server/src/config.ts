import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Repository root (server/src/config.ts → ../..). */
export const ROOT_DIR = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
/** Git-ignored local state: database cluster, generated secrets, keys, mail store. */
export const STATE_DIR = process.env['WICK_STATE_DIR'] ?? join(ROOT_DIR, '.wick');

function int(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer (got "${raw}")`);
  return n;
}

/** A secret from the environment, or one generated once and kept in STATE_DIR (never committed). */
export function persistentSecret(envName: string, fileName: string): string {
  const fromEnv = process.env[envName];
  if (fromEnv) return fromEnv;
  const file = join(STATE_DIR, fileName);
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(STATE_DIR, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

const packageJson = JSON.parse(readFileSync(join(ROOT_DIR, 'package.json'), 'utf8')) as { version: string };

export interface AppConfig {
  readonly env: 'production' | 'development' | 'test';
  readonly version: string;
  readonly host: string;
  readonly port: number;
  /** Public URL of the app, used in e-mail links and as the sign-in redirect base. */
  readonly publicUrl: string;
  readonly databaseUrl: string;
  /** Serve the built UI from this folder (production mode), or not at all. */
  readonly uiDir: string | null;
  readonly logRequests: boolean;
}

export function loadConfig(): AppConfig {
  const env = (process.env['NODE_ENV'] ?? 'development') as AppConfig['env'];
  const host = process.env['WICK_HOST'] ?? '127.0.0.1';
  const port = int('WICK_PORT', 4610);
  const databaseUrl = process.env['DATABASE_URL'];
  if (!databaseUrl) {
    throw new Error('DATABASE_URL is not set. Start through `npm start`, which provides a local PostgreSQL, or set it.');
  }
  const uiDir = process.env['WICK_UI_DIR'] ?? (env === 'production' ? join(ROOT_DIR, 'dist', 'wick-ui', 'browser') : null);
  return {
    env,
    version: packageJson.version,
    host,
    port,
    publicUrl: (process.env['WICK_PUBLIC_URL'] ?? `http://${host}:${port}`).replace(/\/$/, ''),
    databaseUrl,
    uiDir: uiDir && existsSync(uiDir) ? uiDir : null,
    logRequests: env !== 'test' && process.env['WICK_LOG_REQUESTS'] !== '0',
  };
}
