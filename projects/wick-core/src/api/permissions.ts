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
