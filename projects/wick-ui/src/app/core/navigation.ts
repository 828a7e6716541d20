/** The feature areas in the side navigation, in the order an absorbent-product team works through them. */
export interface NavItem {
  readonly path: string;
  readonly label: string;
  readonly icon: string;
  readonly hint: string;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { path: 'materials', label: 'Materials library', icon: 'texture', hint: 'Fibres and webs with reviewed properties' },
  { path: 'liquids', label: 'Test liquids', icon: 'water_drop', hint: 'Water, saline, reference solvents' },
  { path: 'designs', label: 'Designs', icon: 'stacked_line_chart', hint: 'Wicking estimates for a layer or a stack' },
  { path: 'compare', label: 'Compare & decide', icon: 'compare_arrows', hint: 'Variants side by side, recorded decisions' },
  { path: 'lab-data', label: 'Lab data', icon: 'science', hint: 'Measured wicking curves and fits' },
  { path: 'reviews', label: 'Review queue', icon: 'fact_check', hint: 'Entries waiting for a second pair of eyes' },
  { path: 'admin', label: 'Administration', icon: 'admin_panel_settings', hint: 'People, roles and the audit trail' },
];
