import { Routes } from '@angular/router';
import { paramShape, postSlug } from '../core/rendering/param-shape';

export const buildLogRoutes: Routes = [
  { path: '', loadComponent: () => import('./post-list').then((m) => m.PostList), title: 'Build logs — Padside' },
  {
    path: ':slug',
    canMatch: [paramShape('slug', postSlug)],
    loadComponent: () => import('./post-page').then((m) => m.PostPage),
    title: 'Build log — Padside',
  },
];
