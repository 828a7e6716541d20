import type { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

const form = () => import('../library/entry-form').then((m) => m.EntryForm);

/** `/materials/…`: fibres and webs (the parent route checks `library:read`). */
export const MATERIALS_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'webs' },
  {
    path: 'webs/import',
    title: 'Import webs · Wickwright',
    canActivate: [roleGuard('library:edit')],
    data: { title: 'Import webs' },
    loadComponent: () => import('./web-import').then((m) => m.WebImport),
  },
  { path: ':collection', title: 'Materials library · Wickwright', loadComponent: () => import('./materials').then((m) => m.Materials) },
  { path: ':collection/new', title: 'New entry · Wickwright', canActivate: [roleGuard('library:edit')], data: { title: 'New entry' }, loadComponent: form },
  { path: ':collection/:id', title: 'Library entry · Wickwright', loadComponent: () => import('../library/entry-page').then((m) => m.EntryPage) },
  { path: ':collection/:id/edit', title: 'Edit entry · Wickwright', canActivate: [roleGuard('library:edit')], data: { title: 'Edit entry' }, loadComponent: form },
];
