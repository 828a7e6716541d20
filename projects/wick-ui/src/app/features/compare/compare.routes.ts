import type { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

/** Compare & decide (the address holds the selection) and the printable comparison. */
export const COMPARE_ROUTES: Routes = [
  { path: '', title: 'Compare & decide · Wickwright', loadComponent: () => import('./compare-page').then((m) => m.ComparePage) },
  {
    path: 'report',
    title: 'Comparison report · Wickwright',
    canActivate: [roleGuard('designs:export')],
    data: { title: 'Comparison report' },
    loadComponent: () => import('./compare-report').then((m) => m.CompareReportPage),
  },
];
