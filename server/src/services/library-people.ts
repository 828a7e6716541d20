import { Op, type Sequelize, type Transaction } from 'sequelize';
import type { UserRef } from 'wick-core';
import { effectiveRoles } from '../auth/users';
import { authModels } from '../models';

/** Names of the people behind the ids, for revision summaries; unknown ids read "(unknown)". */
export async function userRefs(sequelize: Sequelize, ids: Iterable<number | null | undefined>, transaction?: Transaction): Promise<Map<number, UserRef>> {
  const wanted = [...new Set([...ids].filter((id): id is number => typeof id === 'number'))];
  const map = new Map<number, UserRef>();
  if (wanted.length === 0) return map;
  const { User } = authModels(sequelize);
  const rows = await User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'], transaction });
  for (const r of rows) map.set(r.id, { id: r.id, name: r.name });
  return map;
}

export function refOf(map: Map<number, UserRef>, id: number): UserRef;
export function refOf(map: Map<number, UserRef>, id: number | null): UserRef | null;
export function refOf(map: Map<number, UserRef>, id: number | null): UserRef | null {
  if (id === null) return null;
  return map.get(id) ?? { id, name: '(unknown)' };
}

export interface MailRecipient {
  readonly id: number;
  readonly name: string;
  readonly email: string;
}

/**
 * Everyone who holds the reviewer role now and has an e-mail address, one per address (people are known once
 * they signed in; the same person may exist under two issuers, e.g. demo data and a test stack).
 */
export async function reviewers(sequelize: Sequelize, transaction?: Transaction): Promise<MailRecipient[]> {
  const { User } = authModels(sequelize);
  const rows = await User.findAll({
    where: { [Op.or]: [{ idpRoles: { [Op.contains]: ['reviewer'] } }, { grantedRoles: { [Op.contains]: ['reviewer'] } }] },
    order: [['id', 'ASC']],
    transaction,
  });
  const byEmail = new Map<string, MailRecipient>();
  for (const u of rows) {
    if (effectiveRoles(u).includes('reviewer') && u.email !== '' && !byEmail.has(u.email.toLowerCase())) {
      byEmail.set(u.email.toLowerCase(), { id: u.id, name: u.name, email: u.email });
    }
  }
  return [...byEmail.values()];
}

export async function person(sequelize: Sequelize, id: number, transaction?: Transaction): Promise<MailRecipient | null> {
  const { User } = authModels(sequelize);
  const u = await User.findByPk(id, { transaction });
  return u ? { id: u.id, name: u.name, email: u.email } : null;
}
