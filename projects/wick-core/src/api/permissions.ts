/**
 * Who may do what: the one permission table, shared by the server (enforcement on every route) and the UI
 * (menus and route guards). docs/security.md mirrors it.
 */
export const ROLES = ['engineer', 'materials-scientist', 'reviewer', 'program-manager', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  'materials-scientist': 'Materials scientist',
  reviewer: 'Reviewer',
  'program-manager': 'Programme manager',
  admin: 'Administrator',
};

const ALL: readonly Role[] = ROLES;

export const PERMISSIONS = {
  /** Read library entries (fibres, webs, liquids) and their history. */
  'library:read': ALL,
  /** Create and edit drafts, upload files, submit for review. */
  'library:edit': ['materials-scientist'],
  /** Approve or return entries submitted by someone else. */
  'library:review': ['reviewer'],
  /** Run physics models on the server (single and batch). */
  'compute:run': ALL,
  /** Read projects, designs, variants and comparisons. */
  'designs:read': ['engineer', 'program-manager'],
  /** Create and change projects, designs and variants. */
  'designs:edit': ['engineer'],
  /** Record a decision on a comparison. */
  'decisions:record': ['program-manager'],
  /** Export comparisons and variants (CSV, report). */
  'designs:export': ['engineer', 'program-manager'],
  /** Read lab runs and fits. */
  'labdata:read': ['engineer', 'materials-scientist'],
  /** Upload lab runs, fit them, propose fitted values to the library. */
  'labdata:edit': ['engineer'],
  /** See people and change role overrides. */
  'users:manage': ['admin'],
  /** Read the audit log. */
  'audit:read': ['admin'],
  /** Read the development mailbox (fake SMTP). */
  'mail:read': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** What a route needs: a permission, any signed-in person, or nothing at all. */
export type Access = Permission | 'signed-in' | 'public';

export function rolesAllow(roles: readonly string[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((r) => (allowed as readonly string[]).includes(r));
}

/** The signed-in person as `GET /api/me` returns it. */
export interface CurrentUser {
  readonly id: number;
  readonly subject: string;
  readonly name: string;
  readonly email: string;
  readonly roles: readonly Role[];
  readonly permissions: readonly Permission[];
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

/** Every permission the roles grant, in the table's order. */
export function permissionsOf(roles: readonly string[]): Permission[] {
  return (Object.keys(PERMISSIONS) as Permission[]).filter((p) => rolesAllow(roles, p));
}

/** The roles that hold a permission (for messages such as "this needs the Reviewer role"). */
export function rolesWith(permission: Permission): readonly Role[] {
  return PERMISSIONS[permission];
}

// ── Administration: people, role overrides, audit log ──────────────────────────────────────────────────────

/** A person as the administration screen lists them. Effective roles = (provider's ∪ granted) − revoked. */
export interface AdminUser {
  readonly id: number;
  readonly subject: string;
  readonly name: string;
  readonly email: string;
  /** Roles the identity provider sent at the last sign-in. */
  readonly idpRoles: readonly Role[];
  readonly grantedRoles: readonly Role[];
  readonly revokedRoles: readonly Role[];
  readonly roles: readonly Role[];
  /** ISO 8601. */
  readonly lastSignInAt: string | null;
}

/** `PUT /api/admin/users/:id/roles`: the administrator's overrides on top of the provider's roles. */
export interface RoleOverrides {
  readonly granted: readonly Role[];
  readonly revoked: readonly Role[];
}

/** What the audit log records. */
export const AUDIT_ACTIONS = [
  'sign-in',
  'sign-out',
  'create',
  'update',
  'submit',
  'approve',
  'return',
  'delete',
  'export',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** One audit log row: who did what to which record, when. */
export interface AuditEntry {
  readonly id: number;
  /** ISO 8601. */
  readonly at: string;
  readonly actor: { readonly id: number; readonly name: string } | null;
  readonly action: AuditAction;
  readonly entityType: string;
  readonly entityId: string | null;
  readonly details: Readonly<Record<string, unknown>> | null;
}

/** `GET /api/admin/audit` filters (all optional); `from`/`to` are ISO dates or date-times. */
export interface AuditFilter {
  readonly action?: AuditAction;
  readonly actorId?: number;
  readonly entityType?: string;
  readonly entityId?: string;
  readonly from?: string;
  readonly to?: string;
  readonly limit?: number;
  readonly offset?: number;
}

export interface AuditPage {
  readonly total: number;
  readonly limit: number;
  readonly offset: number;
  readonly entries: readonly AuditEntry[];
  /** Entity types present in the log, for the filter's choices. */
  readonly entityTypes: readonly string[];
}
