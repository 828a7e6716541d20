import nodemailer, { type Transporter } from 'nodemailer';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { libraryModels } from '../models/library';
import type { MailConfig } from './mail-config';

export interface OutboxMessage {
  readonly to: string;
  readonly subject: string;
  readonly text: string;
}

export interface OutboxOptions {
  /** Give up (status `failed`) after this many attempts. */
  readonly maxAttempts?: number;
  /** First retry after this many ms; doubled on each further attempt, at most `maxDelayMs`. */
  readonly baseDelayMs?: number;
  readonly maxDelayMs?: number;
}

interface ClaimedRow {
  id: number;
  to_address: string;
  subject: string;
  text: string;
  attempts: number;
}

/** Loopback SMTP (the local fake) offers an expired STARTTLS certificate: never upgrade on loopback. */
function transportFor(smtpUrl: string): Transporter {
  const url = new URL(smtpUrl);
  const loopback = ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
  return nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 25)),
    secure: url.protocol === 'smtps:',
    ignoreTLS: loopback,
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10_000,
  });
}

/**
 * The mail outbox. Services `enqueue` messages inside the transaction of the decision they report, so a message
 * exists exactly when the decision committed; `kick()` (after commit) sends due messages in the background.
 * A failed send is retried with exponential back-off and never touches the decision. Rows are claimed with
 * `FOR UPDATE SKIP LOCKED` and a lease, so two processes never send the same message twice at once.
 */
export class MailOutboxDispatcher {
  private readonly transport: Transporter;
  private readonly maxAttempts: number;
  private readonly baseDelayMs: number;
  private readonly maxDelayMs: number;
  private running: Promise<void> | null = null;
  private again = false;
  private timer: NodeJS.Timeout | null = null;
  private stopped = false;

  constructor(
    private readonly sequelize: Sequelize,
    readonly config: MailConfig,
    options: OutboxOptions = {},
  ) {
    this.transport = transportFor(config.smtpUrl);
    this.maxAttempts = options.maxAttempts ?? 8;
    this.baseDelayMs = options.baseDelayMs ?? 2000;
    this.maxDelayMs = options.maxDelayMs ?? 10 * 60_000;
  }

  /** Writes messages to the outbox inside `transaction`; they are sent after it commits. */
  async enqueue(transaction: Transaction, messages: readonly OutboxMessage[]): Promise<void> {
    if (messages.length === 0) return;
    const { Outbox } = libraryModels(this.sequelize);
    await Outbox.bulkCreate(
      messages.map((m) => ({ toAddress: m.to, subject: m.subject, text: m.text })),
      { transaction },
    );
    transaction.afterCommit(() => this.kick());
  }

  /** Sends what is due, in the background. Safe to call often. */
  kick(): void {
    if (this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.drain()
      .catch((e: unknown) => console.error('[mail] outbox run failed:', e instanceof Error ? e.message : e))
      .finally(() => {
        this.running = null;
        if (this.again) {
          this.again = false;
          this.kick();
        }
      });
  }

  /** Resolves when the current run (if any) and any run it asked for have finished. For tests and shutdown. */
  async settled(): Promise<void> {
    while (this.running) await this.running;
  }

  /** No more sending from this dispatcher (messages stay in the outbox for another). */
  stop(): void {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    this.transport.close();
  }

  private async drain(): Promise<void> {
    while (!this.stopped) {
      const rows = await this.claim();
      if (rows.length === 0) break;
      for (const row of rows) await this.sendOne(row);
    }
    await this.scheduleNext();
  }

  private async claim(): Promise<ClaimedRow[]> {
    // Lease of two minutes: a process that dies mid-send leaves the row to be retried after it.
    return this.sequelize.query<ClaimedRow>(
      `UPDATE mail_outbox SET next_attempt_at = now() + interval '2 minutes', attempts = attempts + 1
        WHERE id IN (SELECT id FROM mail_outbox WHERE status = 'pending' AND next_attempt_at <= now()
                      ORDER BY id LIMIT 20 FOR UPDATE SKIP LOCKED)
        RETURNING id, to_address, subject, text, attempts`,
      { type: QueryTypes.SELECT },
    );
  }

  private async sendOne(row: ClaimedRow): Promise<void> {
    try {
      await this.transport.sendMail({ from: this.config.from, to: row.to_address, subject: row.subject, text: row.text });
      await this.sequelize.query(`UPDATE mail_outbox SET status = 'sent', sent_at = now(), last_error = NULL WHERE id = :id`, {
        replacements: { id: row.id },
      });
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      const failed = row.attempts >= this.maxAttempts;
      const delay = Math.min(this.maxDelayMs, this.baseDelayMs * 2 ** (row.attempts - 1));
      await this.sequelize.query(
        `UPDATE mail_outbox SET status = :status, last_error = :message,
                next_attempt_at = now() + (:delay || ' milliseconds')::interval WHERE id = :id`,
        { replacements: { id: row.id, status: failed ? 'failed' : 'pending', message: message.slice(0, 2000), delay: String(delay) } },
      );
      console.warn(`[mail] sending message ${row.id} to ${row.to_address} failed (attempt ${row.attempts}${failed ? ', giving up' : ''}): ${message}`);
    }
  }

  /** Wakes up when the next pending message is due (unref'd: never keeps the process alive). */
  private async scheduleNext(): Promise<void> {
    const [next] = await this.sequelize.query<{ due: Date }>(
      `SELECT min(next_attempt_at) AS due FROM mail_outbox WHERE status = 'pending'`,
      { type: QueryTypes.SELECT },
    );
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (!next?.due || this.stopped) return;
    const wait = Math.max(50, new Date(next.due).getTime() - Date.now());
    this.timer = setTimeout(() => this.kick(), Math.min(wait, 2 ** 31 - 1));
    this.timer.unref();
  }
}

const dispatchers = new WeakMap<Sequelize, Map<string, MailOutboxDispatcher>>();
const everyDispatcher = new Set<{ dispatcher: MailOutboxDispatcher; byUrl: Map<string, MailOutboxDispatcher>; key: string }>();

/**
 * One dispatcher per database connection and SMTP address. With `flushOnStart`, the first call also sends
 * anything a previous process left in the outbox.
 */
export function mailOutbox(sequelize: Sequelize, config: MailConfig, options?: OutboxOptions & { flushOnStart?: boolean }): MailOutboxDispatcher {
  let byUrl = dispatchers.get(sequelize);
  if (!byUrl) dispatchers.set(sequelize, (byUrl = new Map()));
  const key = `${config.smtpUrl} ${config.from}`;
  let d = byUrl.get(key);
  if (!d) {
    d = new MailOutboxDispatcher(sequelize, config, options);
    byUrl.set(key, d);
    everyDispatcher.add({ dispatcher: d, byUrl, key });
    if (options?.flushOnStart) d.kick();
  }
  return d;
}

/**
 * Lets every dispatcher that sends to `smtpUrl` finish its current run, then stops and forgets it. For a mail
 * server that is going away (a test's fake): a dispatcher left behind would claim other dispatchers' messages
 * from the shared outbox and delay them with failed attempts.
 */
export async function stopOutboxesSendingTo(smtpUrl: string): Promise<void> {
  for (const entry of [...everyDispatcher]) {
    if (entry.dispatcher.config.smtpUrl !== smtpUrl) continue;
    await entry.dispatcher.settled();
    entry.dispatcher.stop();
    if (entry.byUrl.get(entry.key) === entry.dispatcher) entry.byUrl.delete(entry.key);
    everyDispatcher.delete(entry);
  }
}
