import { loadAccounts, type DemoAccount } from '../../idp-fake/src/accounts';
import { startIdp, type RunningIdp } from '../../idp-fake/src/provider';
import { clientSecret, providerKeys } from '../../idp-fake/src/state';
import { loadConfig } from '../src/config';

/** A person the provider knows who holds no Wickwright role (test only; not a demo account). */
export const NO_ROLE_ACCOUNT: DemoAccount = {
  sub: 'test-visitor-01',
  username: 'visitor',
  password: 'brightwell-demo',
  name: 'Vera Visitor',
  email: 'vera.visitor@brightwell.example',
  title: 'Contractor without a Wickwright role',
  roles: [],
};

/** The demo accounts of idp-fake/accounts.json plus {@link NO_ROLE_ACCOUNT}. */
export const TEST_ACCOUNTS: readonly DemoAccount[] = [...loadAccounts(), NO_ROLE_ACCOUNT];

let running: Promise<RunningIdp> | undefined;

/**
 * The real identity provider (idp-fake), in this process on a free loopback port, sharing the client secret
 * and keys of the test state folder with the app. Started once per test run.
 */
export function testIdp(): Promise<RunningIdp> {
  running ??= startIdp({
    port: 0,
    clientId: 'wickwright',
    clientSecret: clientSecret(),
    appUrls: [loadConfig().publicUrl],
    accounts: TEST_ACCOUNTS,
    keys: providerKeys(),
  });
  return running;
}
