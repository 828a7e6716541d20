import type { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

const form = () => import('../library/entry-form').then((m) => m.EntryForm);

/** `/liquids/…`: built-in and company test liquids (the parent route checks `library:read`). */
export const LIQUIDS_ROUTES: Routes = [
  { path: '', pathMatch: 'full', title: 'Test liquids · Wickwright', loadComponent: () => import('./liquids').then((m) => m.Liquids) },
  { path: 'new', title: 'New liquid · Wickwright', canActivate: [roleGuard('library:edit')], data: { kind: 'liquid', title: 'New liquid' }, loadComponent: form },
  { path: ':id', title: 'Liquid · Wickwright', data: { kind: 'liquid' }, loadComponent: () => import('../library/entry-page').then((m) => m.EntryPage) },
  { path: ':id/edit', title: 'Edit liquid · Wickwright', canActivate: [roleGuard('library:edit')], data: { kind: 'liquid', title: 'Edit liquid' }, loadComponent: form },
];
