import { Routes } from '@angular/router';

const planned = (title: string, arrivesWith: string) => ({
  loadComponent: () => import('./features/planned/planned-feature').then((m) => m.PlannedFeature),
  title: `${title} · Wickwright`,
  data: { title, arrivesWith },
});

export const routes: Routes = [
  { path: '', pathMatch: 'full', title: 'Wickwright', loadComponent: () => import('./features/home/home').then((m) => m.Home) },
  { path: 'materials', ...planned('Materials library', 'Fibre and web entries with revisions and review arrive with the material library.') },
  { path: 'liquids', ...planned('Test liquids', 'Liquid entries (constants or temperature tables) arrive with the material library.') },
  { path: 'designs', ...planned('Designs', 'Interactive wicking estimates for a layer arrive with the design workspace.') },
  { path: 'compare', ...planned('Compare & decide', 'Side-by-side variants and decision records arrive with the design workspace.') },
  { path: 'lab-data', ...planned('Lab data', 'Uploading and fitting measured wicking curves arrives with the lab-data feature.') },
  { path: 'reviews', ...planned('Review queue', 'Approving and returning library entries arrives with the material library.') },
  { path: 'admin', ...planned('Administration', 'People, roles and the audit trail arrive with sign-in.') },
  { path: '**', ...planned('Page not found', 'There is no page at this address. Use the navigation to find your way back.') },
];
