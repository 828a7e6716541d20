import { Router } from 'express';
import { z } from 'zod';
import type { DevMailbox, MailboxMessage } from 'wick-core';
import type { AppDeps } from '../app';
import { AppError } from '../errors';
import { loadMailConfig } from '../mail/mail-config';
import { documentedRoutes } from '../openapi/documented-routes';
import { mailboxMessageSchema } from '../schemas/library';

const devMailboxSchema = z.object({ available: z.boolean(), messages: z.array(mailboxMessageSchema) }).meta({ id: 'DevMailbox' });

/**
 * `/api/dev/mailbox`: the local mail fake's messages for administrators (what the app sent, without a mail
 * client). The fake listens on loopback only; the API passes its JSON through.
 */
export function devMailboxRouter(deps: AppDeps): Router {
  const { mailboxApiUrl } = loadMailConfig(deps.config.publicUrl);
  // An unreachable fake is a state of the development setup, not a server fault: `available: false`.
  const call = async (method: 'GET' | 'DELETE'): Promise<{ available: boolean; body: unknown }> => {
    let res: Response;
    try {
      res = await fetch(`${mailboxApiUrl}/messages`, { method, signal: AbortSignal.timeout(5000) });
    } catch {
      return { available: false, body: null };
    }
    if (!res.ok) throw new AppError(502, 'mailbox-failed', `The mail fake answered ${res.status}.`);
    return { available: true, body: await res.json() };
  };
  return documentedRoutes(Router(), '/api/dev/mailbox', [
    {
      method: 'get',
      path: '/',
      access: 'mail:read',
      summary: 'Messages the app sent, as the local mail fake received them (newest first)',
      description: '`available` is false when the mail fake is not running (then `messages` is empty).',
      tags: ['Development'],
      responses: { 200: { description: 'Messages.', schema: devMailboxSchema } },
      handler: async (_req, res) => {
        res.setHeader('Cache-Control', 'no-store');
        const { available, body } = await call('GET');
        res.json({ available, messages: available ? (body as MailboxMessage[]) : [] } satisfies DevMailbox);
      },
    },
    {
      method: 'delete',
      path: '/',
      access: 'mail:read',
      summary: 'Empty the development mailbox',
      tags: ['Development'],
      responses: { 200: { description: 'Emptied (when the fake runs).', schema: devMailboxSchema } },
      handler: async (_req, res) => {
        const { available } = await call('DELETE');
        res.json({ available, messages: [] } satisfies DevMailbox);
      },
    },
  ]);
}
