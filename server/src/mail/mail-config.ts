/** Where mail goes: an SMTP server (the local fake by default) and, for the dev mailbox, the fake's JSON API. */
export interface MailConfig {
  /** `smtp://host:port`; the local fake listens on WICK_SMTP_PORT (default WICK_PORT + 15). */
  readonly smtpUrl: string;
  /** Sender of every message. */
  readonly from: string;
  /** The fake's mailbox API (WICK_MAIL_API_PORT, default WICK_PORT + 16), read by the admin's dev mailbox. */
  readonly mailboxApiUrl: string;
  /** Public address of the app, for links in messages. */
  readonly publicUrl: string;
}

function port(name: string, fallback: number): number {
  const raw = process.env[name];
  const n = raw ? Number(raw) : fallback;
  if (!Number.isInteger(n) || n <= 0 || n > 65535) throw new Error(`${name} must be a port number (got "${raw}")`);
  return n;
}

/** Reads the mail settings from the environment (see docs/configuration.md). */
export function loadMailConfig(publicUrl: string): MailConfig {
  const appPort = port('WICK_PORT', 4610);
  return {
    smtpUrl: process.env['WICK_SMTP_URL'] ?? `smtp://127.0.0.1:${port('WICK_SMTP_PORT', appPort + 15)}`,
    from: process.env['WICK_MAIL_FROM'] ?? 'Wickwright <wickwright@brightwell.example>',
    mailboxApiUrl: process.env['WICK_MAIL_API_URL'] ?? `http://127.0.0.1:${port('WICK_MAIL_API_PORT', appPort + 16)}`,
    publicUrl,
  };
}
