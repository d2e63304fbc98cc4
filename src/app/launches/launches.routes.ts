import { Routes } from '@angular/router';
import { paramShape, recordId } from '../core/rendering/param-shape';
import { signedInGuard } from '../core/role-guard';

export const launchRoutes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    loadComponent: () => import('./launch-calendar').then((m) => m.LaunchCalendar),
    title: 'Launch days — Padside',
  },
  {
    path: 'flights/:id',
    loadComponent: () => import('./flight-page').then((m) => m.FlightPage),
    title: 'Flight — Padside',
  },
  {
    path: ':id',
    canMatch: [paramShape('id', recordId)],
    loadComponent: () => import('./launch-page').then((m) => m.LaunchPage),
    title: 'Launch day — Padside',
  },
  {
    path: ':id/results',
    loadComponent: () => import('./launch-results').then((m) => m.LaunchResults),
    title: 'Launch results — Padside',
  },
  {
    path: ':id/card',
    canMatch: [signedInGuard],
    loadComponent: () => import('./flight-card-form').then((m) => m.FlightCardForm),
    title: 'File a flight card — Padside',
  },
];
