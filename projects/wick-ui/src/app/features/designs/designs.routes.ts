import type { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

/** The design workspace, every page lazy: projects, a project, the variant and stack editors and the printable report. */
export const DESIGNS_ROUTES: Routes = [
  { path: '', title: 'Designs · Wickwright', loadComponent: () => import('./project-list').then((m) => m.ProjectList) },
  {
    path: 'projects/:projectId',
    title: 'Project · Wickwright',
    loadComponent: () => import('./project-page').then((m) => m.ProjectPage),
  },
  {
    path: ':designId/new',
    title: 'New variant · Wickwright',
    canActivate: [roleGuard('designs:edit')],
    data: { title: 'New variant' },
    loadComponent: () => import('./variant-editor').then((m) => m.VariantEditor),
  },
  {
    path: ':designId/new-stack',
    title: 'New stack · Wickwright',
    canActivate: [roleGuard('designs:edit')],
    data: { title: 'New stack' },
    loadComponent: () => import('./stack/stack-editor').then((m) => m.StackEditor),
  },
  {
    path: 'stacks/:variantId',
    title: 'Stack · Wickwright',
    loadComponent: () => import('./stack/stack-editor').then((m) => m.StackEditor),
  },
  {
    path: 'variants/:variantId',
    title: 'Variant · Wickwright',
    loadComponent: () => import('./variant-editor').then((m) => m.VariantEditor),
  },
  {
    path: 'variants/:variantId/report',
    title: 'Variant report · Wickwright',
    canActivate: [roleGuard('designs:export')],
    data: { title: 'Variant report' },
    loadComponent: () => import('./variant-report').then((m) => m.VariantReportPage),
  },
];
