import type { Permission } from 'wick-core';

/** The feature areas in the side navigation, in the order an absorbent-product team works through them. */
export interface NavItem {
  readonly path: string;
  readonly label: string;
  readonly icon: string;
  readonly hint: string;
  /** What opening the area needs (wick-core's permission table); the menu shows it only to roles that have it. */
  readonly permission: Permission;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { path: 'materials', label: 'Materials library', icon: 'texture', hint: 'Fibres and webs with reviewed properties', permission: 'library:read' },
  { path: 'liquids', label: 'Test liquids', icon: 'water_drop', hint: 'Water, saline, reference solvents', permission: 'library:read' },
  { path: 'designs', label: 'Designs', icon: 'stacked_line_chart', hint: 'Wicking estimates for a layer or a stack', permission: 'designs:read' },
  { path: 'compare', label: 'Compare & decide', icon: 'compare_arrows', hint: 'Variants side by side, recorded decisions', permission: 'designs:read' },
  { path: 'lab-data', label: 'Lab data', icon: 'science', hint: 'Measured wicking curves and fits', permission: 'labdata:read' },
  { path: 'reviews', label: 'Review queue', icon: 'fact_check', hint: 'Entries waiting for a second pair of eyes', permission: 'library:review' },
  { path: 'admin', label: 'Administration', icon: 'admin_panel_settings', hint: 'People, roles and the audit trail', permission: 'users:manage' },
  { path: 'dev-mailbox', label: 'Dev mailbox', icon: 'mail', hint: 'Messages the app sent, as the local mail fake received them', permission: 'mail:read' },
];

/** The areas a person sees: all of them before sign-in (each asks to sign in), only permitted ones after. */
export function visibleNavItems(signedIn: boolean, can: (p: Permission) => boolean): readonly NavItem[] {
  return signedIn ? NAV_ITEMS.filter((i) => can(i.permission)) : NAV_ITEMS;
}
