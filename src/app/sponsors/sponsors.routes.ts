import { Routes } from '@angular/router';
import { roleGuard } from '../core/role-guard';

export const sponsorRoutes: Routes = [
  { path: '', loadComponent: () => import('./sponsor-wall').then((m) => m.SponsorWall), title: 'Sponsors — Padside' },
  {
    path: 'portal',
    canMatch: [roleGuard(['sponsor'])],
    loadComponent: () => import('./sponsor-portal').then((m) => m.SponsorPortal),
    title: 'Sponsor portal — Padside',
  },
];
