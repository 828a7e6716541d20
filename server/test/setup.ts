// Jasmine helper for the server suite: the real identity provider in-process, and generous timeouts.
import { testIdp } from './idp';

jasmine.DEFAULT_TIMEOUT_INTERVAL = 20_000;

beforeAll(async () => {
  const idp = await testIdp();
  // Apps built from here on (testApp()) sign in against it.
  process.env['WICK_OIDC_ISSUER'] = idp.issuer;
});
