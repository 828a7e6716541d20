import { type ResolveFn, Routes } from '@angular/router';
import type { Permission } from 'wick-core';
import { roleGuard } from './core/auth/role-guard';

const planned = (title: string, arrivesWith: string) => ({
  loadComponent: () => import('./features/planned/planned-feature').then((m) => m.PlannedFeature),
  title: `${title} · Wickwright`,
  data: { title, arrivesWith },
});

/** A feature area: open only to roles with `permission` (the sign-in or 403 page shows otherwise). */
const guarded = (permission: Permission) => ({ canActivate: [roleGuard(permission)] });

/** The sign-in and 403 pages stand in for an area: its name leads the tab title. */
const areaTitle =
  (suffix: string): ResolveFn<string> =>
  (route) =>
    `${route.queryParamMap.get('area') || suffix} · ${suffix === 'Sign in' ? 'Sign in' : 'No access'} · Wickwright`;

export const routes: Routes = [
  { path: '', pathMatch: 'full', title: 'Wickwright', loadComponent: () => import('./features/home/home').then((m) => m.Home) },
  { path: 'materials', ...guarded('library:read'), data: { title: 'Materials library' }, loadChildren: () => import('./features/materials/materials.routes').then((m) => m.MATERIALS_ROUTES) },
  { path: 'liquids', ...guarded('library:read'), data: { title: 'Test liquids' }, loadChildren: () => import('./features/liquids/liquids.routes').then((m) => m.LIQUIDS_ROUTES) },
  { path: 'designs', ...guarded('designs:read'), data: { title: 'Designs' }, loadChildren: () => import('./features/designs/designs.routes').then((m) => m.DESIGNS_ROUTES) },
  { path: 'compare', ...guarded('designs:read'), data: { title: 'Compare & decide' }, loadChildren: () => import('./features/compare/compare.routes').then((m) => m.COMPARE_ROUTES) },
  { path: 'lab-data', ...guarded('labdata:read'), data: { title: 'Lab data' }, loadChildren: () => import('./features/lab-data/lab-data.routes').then((m) => m.LAB_DATA_ROUTES) },
  {
    path: 'reviews',
    ...guarded('library:review'),
    title: 'Review queue · Wickwright',
    data: { title: 'Review queue' },
    loadComponent: () => import('./features/reviews/review-queue').then((m) => m.ReviewQueue),
  },
  {
    path: 'dev-mailbox',
    ...guarded('mail:read'),
    title: 'Development mailbox · Wickwright',
    data: { title: 'Development mailbox' },
    loadComponent: () => import('./features/dev-mailbox/dev-mailbox').then((m) => m.DevMailbox),
  },
  {
    path: 'admin',
    ...guarded('users:manage'),
    title: 'Administration · Wickwright',
    data: { title: 'Administration' },
    loadComponent: () => import('./features/admin/admin').then((m) => m.Admin),
  },
  { path: 'sign-in', title: areaTitle('Sign in'), loadComponent: () => import('./core/auth/sign-in-page').then((m) => m.SignInPage) },
  { path: 'forbidden', title: areaTitle('Not available'), loadComponent: () => import('./core/auth/forbidden').then((m) => m.Forbidden) },
  { path: '**', ...planned('Page not found', 'There is no page at this address. Use the navigation to find your way back.') },
];
