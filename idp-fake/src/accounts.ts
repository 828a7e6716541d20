import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** A demo person of the invented Brightwell Hygiene Ltd. (`idp-fake/accounts.json`). */
export interface DemoAccount {
  /** Stable subject identifier (`sub`), as a corporate provider would issue it. */
  readonly sub: string;
  readonly username: string;
  /** Demo password, documented on the sign-in page and in the README. */
  readonly password: string;
  readonly name: string;
  readonly email: string;
  readonly title?: string;
  /** Wickwright roles, sent in the `roles` claim. */
  readonly roles: readonly string[];
}

export const ACCOUNTS_FILE = join(dirname(fileURLToPath(import.meta.url)), '..', 'accounts.json');

export function loadAccounts(file = ACCOUNTS_FILE): DemoAccount[] {
  const accounts = JSON.parse(readFileSync(file, 'utf8')) as DemoAccount[];
  const seen = new Set<string>();
  for (const a of accounts) {
    if (!a.sub || !a.username || !a.password || !a.name || !Array.isArray(a.roles)) {
      throw new Error(`${file}: every account needs sub, username, password, name and roles (${JSON.stringify(a)})`);
    }
    if (seen.has(a.username) || seen.has(a.sub)) throw new Error(`${file}: duplicate account ${a.username}`);
    seen.add(a.username).add(a.sub);
  }
  return accounts;
}
