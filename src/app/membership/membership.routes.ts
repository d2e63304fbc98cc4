import { Routes } from '@angular/router';
import { signedInGuard } from '../core/role-guard';

export const membershipRoutes: Routes = [
  {
    path: '',
    loadComponent: () => import('./membership-home').then((m) => m.MembershipHome),
    title: 'Club dues — Padside',
  },
  {
    path: 'card',
    canMatch: [signedInGuard],
    loadComponent: () => import('./member-card').then((m) => m.MemberCard),
    title: 'Member card — Padside',
  },
];
