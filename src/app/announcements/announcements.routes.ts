import { Routes } from '@angular/router';

export const announcementRoutes: Routes = [
  {
    path: 'confirm',
    loadComponent: () => import('./subscription-confirm').then((m) => m.SubscriptionConfirm),
    title: 'Confirm your e-mails — Padside',
  },
  {
    path: 'unsubscribe',
    loadComponent: () => import('./unsubscribe-page').then((m) => m.UnsubscribePage),
    title: 'Stop e-mails — Padside',
  },
];
