import type { MailboxMessage } from 'wick-core';
import { type FakeSmtp, startFakeSmtp } from '../src/mail/fake-smtp';
import { stopOutboxesSendingTo } from '../src/mail/outbox';

export interface TestMailbox {
  readonly fake: FakeSmtp;
  /** Waits until a message matching `match` arrives (mail is sent after the commit, in the background). */
  waitFor(match: (m: MailboxMessage) => boolean, timeoutMs?: number): Promise<MailboxMessage>;
  /** All messages whose subject contains `text`. */
  withSubject(text: string): MailboxMessage[];
  /** Stops the outboxes sending to the fake, then the fake, and restores the mail settings of the environment. */
  stop(): Promise<void>;
}

/**
 * The real mail fake (smtp-server + mailparser), in-process on free loopback ports. Apps built after this call
 * (testApp()) send to it and read the dev mailbox from it.
 */
export async function startTestMailbox(): Promise<TestMailbox> {
  const fake = await startFakeSmtp({ smtpPort: 0, apiPort: 0, quiet: true });
  const saved = { smtp: process.env['WICK_SMTP_PORT'], api: process.env['WICK_MAIL_API_PORT'] };
  process.env['WICK_SMTP_PORT'] = String(fake.smtpPort);
  process.env['WICK_MAIL_API_PORT'] = String(fake.apiPort);
  const restore = (name: string, value: string | undefined) => {
    if (value === undefined) delete process.env[name];
    else process.env[name] = value;
  };
  return {
    fake,
    async waitFor(match, timeoutMs = 8000) {
      const end = Date.now() + timeoutMs;
      for (;;) {
        const hit = fake.messages().find(match);
        if (hit) return hit;
        if (Date.now() > end) {
          throw new Error(`no matching message within ${timeoutMs} ms; mailbox has: ${fake.messages().map((m) => `${m.to.join(',')}: ${m.subject}`).join(' | ') || 'nothing'}`);
        }
        await new Promise((r) => setTimeout(r, 50));
      }
    },
    withSubject: (text) => fake.messages().filter((m) => m.subject.includes(text)),
    async stop() {
      restore('WICK_SMTP_PORT', saved.smtp);
      restore('WICK_MAIL_API_PORT', saved.api);
      await stopOutboxesSendingTo(`smtp://127.0.0.1:${fake.smtpPort}`);
      await fake.close();
    },
  };
}
