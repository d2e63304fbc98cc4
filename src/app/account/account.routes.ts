import { Routes } from '@angular/router';
import { signedInGuard } from '../core/role-guard';

export const accountRoutes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    canMatch: [signedInGuard],
    loadComponent: () => import('./profile').then((m) => m.Profile),
    title: 'Your account — Padside',
  },
  {
    path: 'flights',
    canMatch: [signedInGuard],
    loadComponent: () => import('../launches/logbook').then((m) => m.Logbook),
    title: 'Your flights — Padside',
  },
  { path: 'sign-in', loadComponent: () => import('./sign-in').then((m) => m.SignIn), title: 'Sign in — Padside' },
  {
    path: 'register',
    loadComponent: () => import('./register').then((m) => m.Register),
    title: 'Create an account — Padside',
  },
  {
    path: 'verify',
    loadComponent: () => import('./verify-email').then((m) => m.VerifyEmail),
    title: 'Confirm e-mail — Padside',
  },
  {
    path: 'forgot',
    loadComponent: () => import('./reset-request').then((m) => m.ResetRequest),
    title: 'Forgot password — Padside',
  },
  {
    path: 'reset',
    loadComponent: () => import('./reset-confirm').then((m) => m.ResetConfirm),
    title: 'New password — Padside',
  },
  {
    path: 'no-access',
    loadComponent: () => import('./no-access').then((m) => m.NoAccess),
    title: 'No access — Padside',
  },
];
