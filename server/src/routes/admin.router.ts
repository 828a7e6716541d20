import { Router } from 'express';
import { z } from 'zod';
import { AUDIT_ACTIONS, ROLES, type AuditFilter, type RoleOverrides } from 'wick-core';
import type { AppDeps } from '../app';
import type { SessionUser } from '../auth';
import { listUsers, setRoleOverrides } from '../auth/users';
import { AppError } from '../errors';
import { AUDIT_PAGE_MAX, listAudit } from '../services/audit';
import { defineRoutes } from './route-table';

const isoDate = z.union([z.iso.date(), z.iso.datetime({ offset: true })]);

export const auditQuerySchema = z.strictObject({
  action: z.enum(AUDIT_ACTIONS).optional(),
  actorId: z.coerce.number().int().positive().optional(),
  entityType: z.string().trim().min(1).max(60).optional(),
  entityId: z.string().trim().min(1).max(100).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  limit: z.coerce.number().int().min(1).max(AUDIT_PAGE_MAX).optional(),
  offset: z.coerce.number().int().min(0).optional(),
}) satisfies z.ZodType<AuditFilter>;

export const roleOverridesSchema = z.strictObject({
  granted: z.array(z.enum(ROLES)).max(ROLES.length),
  revoked: z.array(z.enum(ROLES)).max(ROLES.length),
}) satisfies z.ZodType<RoleOverrides>;

const idSchema = z.coerce.number().int().positive();

function parse<T>(schema: z.ZodType<T>, value: unknown, where: string): T {
  const result = schema.safeParse(value);
  if (!result.success) {
    throw new AppError(422, 'validation-failed', `Invalid ${where}: ${z.prettifyError(result.error)}`, { issues: result.error.issues });
  }
  return result.data;
}

/** People with their role overrides, and the audit log (administrators). */
export function adminRouter({ sequelize }: AppDeps): Router {
  return defineRoutes(Router(), '/api/admin', [
    {
      method: 'get',
      path: '/users',
      access: 'users:manage',
      handlers: [async (_req, res) => void res.json(await listUsers(sequelize))],
    },
    {
      method: 'put',
      path: '/users/:id/roles',
      access: 'users:manage',
      handlers: [
        async (req, res) => {
          const id = parse(idSchema, req.params['id'], 'person id');
          const overrides = parse(roleOverridesSchema, req.body, 'body');
          res.json(await setRoleOverrides(sequelize, res.locals['user'] as SessionUser, id, overrides));
        },
      ],
    },
    {
      method: 'get',
      path: '/audit',
      access: 'audit:read',
      handlers: [async (req, res) => void res.json(await listAudit(sequelize, parse(auditQuerySchema, req.query, 'filter')))],
    },
  ]);
}
