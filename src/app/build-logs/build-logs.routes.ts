import { Routes } from '@angular/router';

export const buildLogRoutes: Routes = [
  { path: '', loadComponent: () => import('./post-list').then((m) => m.PostList), title: 'Build logs — Padside' },
  { path: ':slug', loadComponent: () => import('./post-page').then((m) => m.PostPage), title: 'Build log — Padside' },
];
