import { Routes } from '@angular/router';
import { staffGuard } from './core/role-guard';

export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    loadComponent: () => import('./shop/storefront').then((m) => m.Storefront),
    title: 'Merch, club dues and build logs — Padside',
  },
  { path: 'shop', loadChildren: () => import('./shop/shop.routes').then((m) => m.shopRoutes) },
  { path: 'membership', loadChildren: () => import('./membership/membership.routes').then((m) => m.membershipRoutes) },
  { path: 'build-logs', loadChildren: () => import('./build-logs/build-logs.routes').then((m) => m.buildLogRoutes) },
  { path: 'launches', loadChildren: () => import('./launches/launches.routes').then((m) => m.launchRoutes) },
  { path: 'sponsors', loadChildren: () => import('./sponsors/sponsors.routes').then((m) => m.sponsorRoutes) },
  {
    path: 'subscriptions',
    loadChildren: () => import('./announcements/announcements.routes').then((m) => m.announcementRoutes),
  },
  { path: 'account', loadChildren: () => import('./account/account.routes').then((m) => m.accountRoutes) },
  {
    path: 'privacy',
    loadComponent: () => import('./privacy/privacy-page').then((m) => m.PrivacyPage),
    title: 'Privacy — Padside',
  },
  {
    path: 'console',
    canMatch: [staffGuard],
    loadChildren: () => import('./admin/admin.routes').then((m) => m.adminRoutes),
  },
  { path: '**', loadComponent: () => import('./core/not-found').then((m) => m.NotFound), title: 'Not found — Padside' },
];
