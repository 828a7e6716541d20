import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { APP_URL } from './browser';

/** A demo person of idp-fake/accounts.json. */
export interface DemoAccount {
  readonly username: string;
  readonly password: string;
  readonly name: string;
  readonly roles: readonly string[];
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = JSON.parse(
  readFileSync(join(process.cwd(), 'idp-fake', 'accounts.json'), 'utf8'),
) as DemoAccount[];

export function demoAccount(username: string): DemoAccount {
  const a = DEMO_ACCOUNTS.find((x) => x.username === username);
  if (!a) throw new Error(`no demo account ${username}`);
  return a;
}

/** On the provider's sign-in page: types the username and password and submits, then waits to be back in the app. */
export async function submitProviderLogin(page: Page, account: DemoAccount): Promise<void> {
  await page.locator('#username').fill(account.username);
  await page.locator('#password').fill(account.password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.origin === new URL(APP_URL).origin);
  await page.locator('wick-user-menu button', { hasText: account.name }).waitFor();
}

/**
 * Signs in through the real provider pages from the app's own "Sign in" button (starting at `path`), as a
 * person would. Reusable by every feature's browser tests: `await signIn(page, 'tomas')`.
 */
export async function signIn(page: Page, username: string, path = '/'): Promise<DemoAccount> {
  const account = demoAccount(username);
  await page.goto(APP_URL + path, { waitUntil: 'networkidle' });
  await page.locator('wick-user-menu button', { hasText: 'Sign in' }).click();
  await page.waitForURL('**/interaction/**');
  await submitProviderLogin(page, account);
  return account;
}

/** Opens the user menu and signs out; waits until the app is back, signed out. */
export async function signOut(page: Page): Promise<void> {
  await page.locator('wick-user-menu button[aria-label="Account menu"]').click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.waitForURL((url) => url.origin === new URL(APP_URL).origin && url.pathname === '/');
  await page.locator('wick-user-menu button', { hasText: 'Sign in' }).waitFor();
}
