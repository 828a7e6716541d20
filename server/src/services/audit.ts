import { Op, type Sequelize, type Transaction, type WhereOptions } from 'sequelize';
import type { AuditAction, AuditEntry, AuditFilter, AuditPage } from 'wick-core';
import { authModels, type AuditLog } from '../models';

/** What one audit row says. */
export interface AuditInput {
  /** `res.locals.user.id` of the person acting; `null` only for system events. */
  readonly actorId: number | null;
  /** One of wick-core's `AUDIT_ACTIONS`: sign-in, sign-out, create, update, submit, approve, return, delete, export. */
  readonly action: AuditAction;
  /** Kind of record, kebab-case singular: `'library-entry'`, `'user'`, `'design'` … (the admin screen filters on it). */
  readonly entityType: string;
  /** The record's id (numbers are stored as text); `null` when the action has no single record. */
  readonly entityId?: string | number | null;
  /** Small JSON with what a reader needs later (names, old → new values, a comment). No secrets, no file contents. */
  readonly details?: Readonly<Record<string, unknown>> | null;
}

/** Sequelize keeps a transaction's instance in `transaction.sequelize`; its typings leave the field out. */
function sequelizeOf(tx: Transaction): Sequelize {
  return (tx as unknown as { sequelize: Sequelize }).sequelize;
}

/**
 * Appends one row to the audit log **inside the caller's transaction**, so the record of a change commits or
 * rolls back with the change itself. Call it from services, after the change, with the same `tx`:
 *
 * ```ts
 * await sequelize.transaction(async (tx) => {
 *   const revision = await Revision.create({ … }, { transaction: tx });
 *   await audit(tx, {
 *     actorId: user.id,                 // res.locals.user (SessionUser) of the request
 *     action: 'submit',
 *     entityType: 'library-entry',
 *     entityId: revision.entryId,
 *     details: { revision: revision.number, name: revision.name },
 *   });
 * });
 * ```
 *
 * Events without a data change (sign-out, export) still pass a transaction: `sequelize.transaction((tx) => audit(tx, …))`.
 * Throws when the row cannot be written, which rolls the change back: no change goes unrecorded.
 */
export async function audit(tx: Transaction, entry: AuditInput): Promise<void> {
  const { AuditLog } = authModels(sequelizeOf(tx));
  await AuditLog.create(
    {
      actorId: entry.actorId,
      action: entry.action,
      entityType: entry.entityType,
      entityId: entry.entityId === undefined || entry.entityId === null ? null : String(entry.entityId),
      details: entry.details ? { ...entry.details } : null,
    },
    { transaction: tx },
  );
}

export const AUDIT_PAGE_DEFAULT = 50;
export const AUDIT_PAGE_MAX = 200;

/** Start of a date-only `from`, end of a date-only `to` (inclusive day), or the exact instant given. */
function bound(value: string, end: boolean): Date {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) {
    const day = new Date(`${value}T00:00:00.000Z`);
    return end ? new Date(day.getTime() + 24 * 3600 * 1000) : day;
  }
  return new Date(value);
}

function toEntry(row: AuditLog): AuditEntry {
  return {
    id: row.id,
    at: row.at.toISOString(),
    actor: row.actor ? { id: row.actor.id, name: row.actor.name } : row.actorId === null ? null : { id: row.actorId, name: '(unknown)' },
    action: row.action,
    entityType: row.entityType,
    entityId: row.entityId,
    details: row.details,
  };
}

/** The audit log, newest first, filtered and paged (the admin screen). */
export async function listAudit(sequelize: Sequelize, filter: AuditFilter): Promise<AuditPage> {
  const { AuditLog, User } = authModels(sequelize);
  const limit = Math.min(filter.limit ?? AUDIT_PAGE_DEFAULT, AUDIT_PAGE_MAX);
  const offset = filter.offset ?? 0;
  const at: Record<symbol, Date> = {};
  if (filter.from) at[Op.gte] = bound(filter.from, false);
  if (filter.to) at[Op.lt] = bound(filter.to, true);
  const where: WhereOptions<AuditLog> = {
    ...(filter.action ? { action: filter.action } : {}),
    ...(filter.actorId !== undefined ? { actorId: filter.actorId } : {}),
    ...(filter.entityType ? { entityType: filter.entityType } : {}),
    ...(filter.entityId ? { entityId: filter.entityId } : {}),
    ...(filter.from || filter.to ? { at } : {}),
  };
  const { count, rows } = await AuditLog.findAndCountAll({
    where,
    include: [{ model: User, as: 'actor', attributes: ['id', 'name'] }],
    order: [
      ['at', 'DESC'],
      ['id', 'DESC'],
    ],
    limit,
    offset,
  });
  const types = (await AuditLog.findAll({
    attributes: ['entityType'],
    group: ['entityType'],
    order: [['entityType', 'ASC']],
    raw: true,
  })) as unknown as { entityType: string }[];
  return { total: count, limit, offset, entries: rows.map(toEntry), entityTypes: types.map((t) => t.entityType) };
}
