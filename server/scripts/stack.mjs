// Starts the identity provider, the mail fake and the API server as child processes.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, log, startChild, tsxArgs, waitForPort } from './bootstrap.mjs';

const TSX = join(ROOT, 'node_modules', '.bin', 'tsx');

/** Ports of one running stack: `npm start` uses the defaults, `npm test` its own set. */
export function stackPorts(base) {
  return { app: base, idp: base + 1, smtp: base + 15, mailApi: base + 16 };
}

/**
 * @param {{ databaseUrl: string, ports: ReturnType<typeof stackPorts>, env?: Record<string,string>, nodeEnv?: string }} o
 */
export async function startStack({ databaseUrl, ports, env = {}, nodeEnv = 'production' }) {
  const children = [];
  const appUrl = `http://127.0.0.1:${ports.app}`;
  const idpUrl = `http://127.0.0.1:${ports.idp}`;
  const common = {
    NODE_ENV: nodeEnv,
    DATABASE_URL: databaseUrl,
    WICK_PORT: String(ports.app),
    WICK_PUBLIC_URL: appUrl,
    WICK_OIDC_ISSUER: process.env.WICK_OIDC_ISSUER ?? idpUrl,
    WICK_IDP_PORT: String(ports.idp),
    WICK_SMTP_PORT: String(ports.smtp),
    WICK_MAIL_API_PORT: String(ports.mailApi),
    ...env,
  };
  const idpEntry = 'idp-fake/src/main.ts';
  if (existsSync(join(ROOT, idpEntry)) && !process.env.WICK_OIDC_ISSUER) {
    children.push(startChild('idp', TSX, tsxArgs(idpEntry), common));
    await waitForPort(ports.idp, 'The identity provider');
  }
  const mailEntry = 'server/src/mail/fake-smtp.ts';
  if (existsSync(join(ROOT, mailEntry)) && !process.env.WICK_SMTP_URL) {
    children.push(startChild('mail', TSX, tsxArgs(mailEntry), common));
    await waitForPort(ports.smtp, 'The mail fake');
  }
  children.push(startChild('api', TSX, tsxArgs('server/src/main.ts'), common));
  await waitForPort(ports.app, 'The API server');
  return {
    appUrl,
    idpUrl,
    children,
    async stop() {
      for (const c of children.reverse()) {
        if (c.exitCode === null) c.kill('SIGTERM');
      }
      await Promise.all(
        children.map((c) => (c.exitCode !== null ? null : new Promise((r) => { c.once('exit', r); setTimeout(r, 5000); }))),
      );
      log('Stopped the identity provider, mail fake and API server.');
    },
  };
}
