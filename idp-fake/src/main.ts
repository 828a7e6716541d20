/**
 * Local OpenID Connect provider standing in for corporate single sign-on. Started by `npm start` / `npm test`
 * (server/scripts/stack.mjs) with tsx. Settings come from the same environment variables as the app.
 */
import { loadAccounts } from './accounts';
import { startIdp } from './provider';
import { clientSecret, providerKeys } from './state';

const appPort = Number(process.env['WICK_PORT'] ?? 4610);
const port = Number(process.env['WICK_IDP_PORT'] ?? appPort + 1);
const publicUrl = (process.env['WICK_PUBLIC_URL'] ?? `http://127.0.0.1:${appPort}`).replace(/\/$/, '');
// More app addresses allowed to receive sign-in callbacks, e.g. the `ng serve` origin in development.
const extraAppUrls = (process.env['WICK_IDP_EXTRA_APP_URLS'] ?? '').split(',').map((u) => u.trim()).filter(Boolean);

const idp = await startIdp({
  host: process.env['WICK_IDP_HOST'] ?? '127.0.0.1',
  port,
  issuer: process.env['WICK_OIDC_ISSUER'] ?? `http://127.0.0.1:${port}`,
  clientId: process.env['WICK_OIDC_CLIENT_ID'] ?? 'wickwright',
  clientSecret: clientSecret(),
  appUrls: [publicUrl, ...extraAppUrls],
  accounts: loadAccounts(),
  keys: providerKeys(),
});
console.log(`Demo identity provider listening, issuer ${idp.issuer}`);

function shutdown(): void {
  void idp.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
