/**
 * A local stand-in for the company's mail server: accepts SMTP on 127.0.0.1:WICK_SMTP_PORT (no TLS, no auth),
 * keeps every message in memory and in WICK_STATE_DIR/mailbox.json, and serves them as JSON on
 * 127.0.0.1:WICK_MAIL_API_PORT for the admin's dev mailbox page (proxied by the API) and for tests.
 *
 *   GET    /messages   newest first (MailboxMessage[])
 *   DELETE /messages   empties the mailbox
 *   GET    /health     { status: 'ok', count }
 *
 * `npm start` and `npm test` start it (server/scripts/stack.mjs); tests may also start it in-process.
 */
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { type AddressObject, simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { MailboxMessage } from 'wick-core';

/** Messages kept; older ones are dropped first. */
const MAX_MESSAGES = 500;
const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

export interface FakeSmtpOptions {
  /** 0 picks a free port. */
  readonly smtpPort: number;
  readonly apiPort: number;
  /** Folder for mailbox.json; omit to keep messages in memory only. */
  readonly stateDir?: string;
  readonly quiet?: boolean;
}

export interface FakeSmtp {
  readonly smtpPort: number;
  readonly apiPort: number;
  messages(): readonly MailboxMessage[];
  clear(): void;
  close(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  if (!a) return [];
  return (Array.isArray(a) ? a : [a]).flatMap((o) => o.value.map((v) => v.address ?? '').filter((x) => x !== ''));
}

export async function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const file = options.stateDir ? join(options.stateDir, 'mailbox.json') : null;
  let messages: MailboxMessage[] = [];
  if (file && existsSync(file)) {
    try {
      messages = JSON.parse(readFileSync(file, 'utf8')) as MailboxMessage[];
    } catch {
      messages = [];
    }
  }
  const persist = (): void => {
    if (!file) return;
    mkdirSync(dirname(file), { recursive: true });
    // Write then rename: a crash never leaves half a file.
    writeFileSync(file + '.tmp', JSON.stringify(messages, null, 1));
    renameSync(file + '.tmp', file);
  };
  const log = (m: string): void => {
    if (!options.quiet) console.log(m);
  };

  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: MAX_MESSAGE_BYTES,
    banner: 'Wickwright development mail fake',
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const message: MailboxMessage = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: addresses(parsed.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: envelopeTo.length ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
          };
          messages.unshift(message);
          if (messages.length > MAX_MESSAGES) messages.length = MAX_MESSAGES;
          persist();
          log(`received "${message.subject}" for ${message.to.join(', ')}`);
          callback();
        })
        .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
    },
  });

  const api: Server = createServer((req, res) => {
    const send = (status: number, body: unknown): void => {
      res.writeHead(status, { 'Content-Type': 'application/json', 'Cache-Control': 'no-store' });
      res.end(JSON.stringify(body));
    };
    const path = (req.url ?? '/').split('?')[0];
    if (path === '/messages' && req.method === 'GET') return send(200, messages);
    if (path === '/messages' && req.method === 'DELETE') {
      messages = [];
      persist();
      return send(200, { deleted: true });
    }
    if (path === '/health' && req.method === 'GET') return send(200, { status: 'ok', count: messages.length });
    send(404, { error: { code: 'not-found', message: `No route ${req.method} ${path}` } });
  });

  const listen = (server: { listen: (port: number, host: string, cb: () => void) => unknown; once: (e: 'error', cb: (err: Error) => void) => unknown }, port: number) =>
    new Promise<void>((ok, fail) => {
      server.once('error', fail);
      server.listen(port, '127.0.0.1', ok);
    });
  await listen(smtp.server, options.smtpPort);
  await listen(api, options.apiPort);
  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const apiPort = (api.address() as AddressInfo).port;
  log(`mail fake: SMTP on 127.0.0.1:${smtpPort}, mailbox API on http://127.0.0.1:${apiPort}/messages`);

  return {
    smtpPort,
    apiPort,
    messages: () => messages,
    clear() {
      messages = [];
      persist();
    },
    close: () =>
      new Promise<void>((ok) => {
        api.closeAllConnections();
        api.close(() => smtp.close(() => ok()));
      }),
  };
}

// Run as a program (server/scripts/stack.mjs): ports from the environment, the mailbox in WICK_STATE_DIR.
const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(resolve(process.argv[1])).href;
if (isMain) {
  const appPort = Number(process.env['WICK_PORT'] ?? 4610);
  const root = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', '..');
  const fake = await startFakeSmtp({
    smtpPort: Number(process.env['WICK_SMTP_PORT'] ?? appPort + 15),
    apiPort: Number(process.env['WICK_MAIL_API_PORT'] ?? appPort + 16),
    stateDir: process.env['WICK_STATE_DIR'] ?? join(root, '.wick'),
  });
  const stop = (): void => void fake.close().finally(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
