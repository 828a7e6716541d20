import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { createWeb, transition, uniqueName } from '../../test/library';
import { signInAs } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';
import { startFakeSmtp } from './fake-smtp';
import { loadConfig } from '../config';
import { loadMailConfig } from './mail-config';
import { MailOutboxDispatcher, mailOutbox } from './outbox';

/** A loopback port nothing listens on (bound, read and released). */
async function deadPort(): Promise<number> {
  const s = createServer();
  await new Promise<void>((ok) => s.listen(0, '127.0.0.1', ok));
  const port = (s.address() as AddressInfo).port;
  await new Promise<void>((ok) => s.close(() => ok()));
  return port;
}

interface OutboxRow {
  to_address: string;
  status: string;
  attempts: number;
  last_error: string | null;
}

const rowsFor = (subjectPart: string) =>
  testSequelize().query<OutboxRow>(
    `SELECT to_address, status, attempts, last_error FROM mail_outbox WHERE subject LIKE :s ORDER BY id`,
    { replacements: { s: `%${subjectPart}%` }, type: QueryTypes.SELECT },
  );

async function until(check: () => Promise<boolean>, timeoutMs = 8000): Promise<void> {
  const end = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > end) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe('mail outbox', () => {
  it('when the mail server is down, then review decisions still succeed and their messages wait in the outbox for a retry', async () => {
    const port = await deadPort();
    const saved = process.env['WICK_SMTP_PORT'];
    process.env['WICK_SMTP_PORT'] = String(port);
    try {
      const app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
      const tomas = (await signInAs(app, 'materials-scientist')).agent;
      const grace = (await signInAs(app, 'reviewer')).agent;
      const name = uniqueName('Offline mail');
      let e = await createWeb(tomas, name);
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      await transition(grace, e.id, 'approve', e.version).expect(200);
      await until(async () => (await rowsFor(name)).every((r) => r.attempts >= 1));
      const rows = await rowsFor(name);
      expect(rows.length).toBeGreaterThanOrEqual(2);
      for (const r of rows) {
        expect(r.status).toBe('pending');
        expect(r.last_error).toContain('ECONNREFUSED');
      }
      expect(rows.map((r) => r.to_address)).toContain('tomas.lindqvist@brightwell.example');
      // Leave nothing behind for the dispatchers of other specs.
      mailOutbox(testSequelize(), loadMailConfig(loadConfig().publicUrl)).stop();
      await testSequelize().query(`UPDATE mail_outbox SET status = 'failed' WHERE subject LIKE :s`, { replacements: { s: `%${name}%` } });
    } finally {
      if (saved === undefined) delete process.env['WICK_SMTP_PORT'];
      else process.env['WICK_SMTP_PORT'] = saved;
    }
  });

  it('when a send fails and the server comes back, then the retry delivers it once; after the last attempt it is marked failed', async () => {
    const sequelize = testSequelize();
    const port = await deadPort();
    const dispatcher = new MailOutboxDispatcher(
      sequelize,
      { smtpUrl: `smtp://127.0.0.1:${port}`, from: 'Wickwright <wickwright@brightwell.example>', mailboxApiUrl: '', publicUrl: 'http://127.0.0.1' },
      { maxAttempts: 3, baseDelayMs: 100, maxDelayMs: 200 },
    );
    const subject = uniqueName('Retry me');
    await sequelize.transaction((t) => dispatcher.enqueue(t, [{ to: 'grace.adebayo@brightwell.example', subject, text: 'hello' }]));
    await until(async () => (await rowsFor(subject))[0]?.attempts >= 1);
    expect((await rowsFor(subject))[0].status).toBe('pending');

    const fake = await startFakeSmtp({ smtpPort: port, apiPort: 0, quiet: true });
    try {
      await until(async () => (await rowsFor(subject))[0].status === 'sent');
      await dispatcher.settled();
      const got = fake.messages().filter((m) => m.subject === subject);
      expect(got.length).toBe(1);
      expect(got[0].to).toEqual(['grace.adebayo@brightwell.example']);
    } finally {
      await fake.close();
    }

    const doomed = uniqueName('Never delivered');
    await sequelize.transaction((t) => dispatcher.enqueue(t, [{ to: 'nobody@brightwell.example', subject: doomed, text: 'x' }]));
    await until(async () => (await rowsFor(doomed))[0]?.status === 'failed');
    expect((await rowsFor(doomed))[0].attempts).toBe(3);
    dispatcher.stop();
  });

  it('when the transaction that queued a message rolls back, then the message is never sent', async () => {
    const sequelize = testSequelize();
    const fake = await startFakeSmtp({ smtpPort: 0, apiPort: 0, quiet: true });
    const dispatcher = new MailOutboxDispatcher(sequelize, {
      smtpUrl: `smtp://127.0.0.1:${fake.smtpPort}`,
      from: 'wickwright@brightwell.example',
      mailboxApiUrl: '',
      publicUrl: 'http://127.0.0.1',
    });
    const subject = uniqueName('Rolled back');
    await expectAsync(
      sequelize.transaction(async (t) => {
        await dispatcher.enqueue(t, [{ to: 'grace.adebayo@brightwell.example', subject, text: 'x' }]);
        throw new Error('decision failed');
      }),
    ).toBeRejectedWithError('decision failed');
    dispatcher.kick();
    await dispatcher.settled();
    expect(await rowsFor(subject)).toEqual([]);
    expect(fake.messages().length).toBe(0);
    dispatcher.stop();
    await fake.close();
  });
});
