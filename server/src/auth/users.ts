import { type Sequelize, UniqueConstraintError } from 'sequelize';
import { ROLES, permissionsOf, type AdminUser, type CurrentUser, type Role, type RoleOverrides } from 'wick-core';
import { AppError } from '../errors';
import { authModels, type User } from '../models';
import { audit } from '../services/audit';
import type { SessionUser } from './authorize';

/** Known roles only, each once, in the permission table's order. */
export function knownRoles(values: readonly unknown[]): Role[] {
  return ROLES.filter((r) => values.includes(r));
}

/** Effective roles: the provider's and the granted ones, less the revoked ones. */
export function effectiveRoles(user: Pick<User, 'idpRoles' | 'grantedRoles' | 'revokedRoles'>): Role[] {
  return ROLES.filter((r) => (user.idpRoles.includes(r) || user.grantedRoles.includes(r)) && !user.revokedRoles.includes(r));
}

/** A roles claim may be an array or a space-separated string; anything that is not a Wickwright role is dropped. */
export function rolesFromClaim(claim: unknown): Role[] {
  if (Array.isArray(claim)) return knownRoles(claim);
  if (typeof claim === 'string') return knownRoles(claim.split(/[\s,]+/));
  return [];
}

export interface SignInProfile {
  readonly issuer: string;
  readonly subject: string;
  readonly name: string;
  readonly email: string;
  readonly idpRoles: readonly Role[];
}

/** Creates or refreshes the person at sign-in and records the sign-in, in one transaction. */
export async function recordSignIn(sequelize: Sequelize, profile: SignInProfile): Promise<User> {
  const { User } = authModels(sequelize);
  const attempt = () =>
    sequelize.transaction(async (transaction) => {
      const values = { name: profile.name, email: profile.email, idpRoles: [...profile.idpRoles], lastSignInAt: new Date() };
      let user = await User.findOne({ where: { issuer: profile.issuer, subject: profile.subject }, transaction, lock: true });
      if (user) await user.update(values, { transaction });
      else user = await User.create({ issuer: profile.issuer, subject: profile.subject, ...values }, { transaction });
      await audit(transaction, {
        actorId: user.id,
        action: 'sign-in',
        entityType: 'user',
        entityId: user.id,
        details: { roles: effectiveRoles(user) },
      });
      return user;
    });
  try {
    return await attempt();
  } catch (e) {
    // Two first sign-ins of the same person at once: the second finds the row on retry.
    if (e instanceof UniqueConstraintError) return attempt();
    throw e;
  }
}

/** The person behind a session, with roles as they are now (an administrator's change applies at once). */
export async function loadSessionUser(sequelize: Sequelize, id: number): Promise<SessionUser | null> {
  const user = await authModels(sequelize).User.findByPk(id);
  return user ? { id: user.id, roles: effectiveRoles(user) } : null;
}

export function toCurrentUser(user: User): CurrentUser {
  const roles = effectiveRoles(user);
  return { id: user.id, subject: user.subject, name: user.name, email: user.email, roles, permissions: permissionsOf(roles) };
}

export function toAdminUser(user: User): AdminUser {
  return {
    id: user.id,
    subject: user.subject,
    name: user.name,
    email: user.email,
    idpRoles: knownRoles(user.idpRoles),
    grantedRoles: knownRoles(user.grantedRoles),
    revokedRoles: knownRoles(user.revokedRoles),
    roles: effectiveRoles(user),
    lastSignInAt: user.lastSignInAt ? user.lastSignInAt.toISOString() : null,
  };
}

export async function findUser(sequelize: Sequelize, id: number): Promise<User> {
  const user = await authModels(sequelize).User.findByPk(id);
  if (!user) throw new AppError(404, 'not-found', `There is no person with id ${id}.`);
  return user;
}

export async function listUsers(sequelize: Sequelize): Promise<AdminUser[]> {
  const users = await authModels(sequelize).User.findAll({ order: [['name', 'ASC'], ['id', 'ASC']] });
  return users.map(toAdminUser);
}

/**
 * Replaces a person's role overrides and records the change. An administrator cannot take the admin role away
 * from themselves (someone must be left who can give it back).
 */
export async function setRoleOverrides(
  sequelize: Sequelize,
  actor: SessionUser,
  userId: number,
  overrides: RoleOverrides,
): Promise<AdminUser> {
  const granted = knownRoles(overrides.granted);
  const revoked = knownRoles(overrides.revoked);
  const both = granted.filter((r) => revoked.includes(r));
  if (both.length) {
    throw new AppError(422, 'validation-failed', `A role cannot be granted and revoked at once: ${both.join(', ')}.`, { roles: both });
  }
  return sequelize.transaction(async (transaction) => {
    const { User } = authModels(sequelize);
    const user = await User.findByPk(userId, { transaction, lock: true });
    if (!user) throw new AppError(404, 'not-found', `There is no person with id ${userId}.`);
    const before = toAdminUser(user);
    user.grantedRoles = granted;
    user.revokedRoles = revoked;
    if (user.id === actor.id && !effectiveRoles(user).includes('admin')) {
      throw new AppError(409, 'self-lockout', 'You cannot take the administrator role away from yourself.');
    }
    await user.save({ transaction });
    await audit(transaction, {
      actorId: actor.id,
      action: 'update',
      entityType: 'user',
      entityId: user.id,
      details: {
        name: user.name,
        change: 'role-overrides',
        before: { granted: before.grantedRoles, revoked: before.revokedRoles, roles: before.roles },
        after: { granted, revoked, roles: effectiveRoles(user) },
      },
    });
    return toAdminUser(user);
  });
}

