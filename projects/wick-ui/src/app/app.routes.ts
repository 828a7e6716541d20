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
  { path: 'materials', ...guarded('library:read'), ...planned('Materials library', 'Fibre and web entries with revisions and review arrive with the material library.') },
  { path: 'liquids', ...guarded('library:read'), ...planned('Test liquids', 'Liquid entries (constants or temperature tables) arrive with the material library.') },
  { path: 'designs', ...guarded('designs:read'), ...planned('Designs', 'Interactive wicking estimates for a layer arrive with the design workspace.') },
  { path: 'compare', ...guarded('designs:read'), ...planned('Compare & decide', 'Side-by-side variants and decision records arrive with the design workspace.') },
  { path: 'lab-data', ...guarded('labdata:read'), ...planned('Lab data', 'Uploading and fitting measured wicking curves arrives with the lab-data feature.') },
  { path: 'reviews', ...guarded('library:review'), ...planned('Review queue', 'Approving and returning library entries arrives with the material library.') },
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
