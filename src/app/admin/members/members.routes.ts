import { Routes } from '@angular/router';

export const membersRoutes: Routes = [
  { path: '', loadComponent: () => import('./roster').then((m) => m.Roster), title: 'Members — Padside console' },
  {
    path: 'summary',
    loadComponent: () => import('./dues-summary').then((m) => m.DuesSummary),
    title: 'Dues summary — Padside console',
  },
  {
    path: ':id',
    loadComponent: () => import('./member-detail').then((m) => m.MemberDetail),
    title: 'Member — Padside console',
  },
];
