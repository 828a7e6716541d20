import type { Routes } from '@angular/router';
import { roleGuard } from '../../core/auth/role-guard';

/** `/lab-data/…`, every page lazy (the parent route checks `labdata:read`). */
export const LAB_DATA_ROUTES: Routes = [
  { path: '', title: 'Lab data · Wickwright', loadComponent: () => import('./lab-data').then((m) => m.LabData) },
  {
    path: 'runs/new',
    title: 'Upload a run · Wickwright',
    canActivate: [roleGuard('labdata:edit')],
    data: { title: 'Upload a run' },
    loadComponent: () => import('./run-upload').then((m) => m.RunUpload),
  },
  { path: 'runs/:id', title: 'Lab run · Wickwright', loadComponent: () => import('./run-page').then((m) => m.RunPage) },
  { path: 'sets/:id', title: 'Replicate set · Wickwright', loadComponent: () => import('./set-page').then((m) => m.SetPage) },
  { path: 'contact-angle', title: 'Contact angle · Wickwright', loadComponent: () => import('./contact-angle-page').then((m) => m.ContactAnglePage) },
];
