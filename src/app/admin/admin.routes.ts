import { Routes } from '@angular/router';
import { roleGuard } from '../core/role-guard';
import { ConsoleFrame } from './console-frame';

export const adminRoutes: Routes = [
  {
    path: '',
    component: ConsoleFrame,
    children: [
      {
        path: '',
        pathMatch: 'full',
        loadComponent: () => import('./dashboard/dashboard').then((m) => m.Dashboard),
        title: 'Overview — Padside console',
      },
      {
        path: 'users',
        canMatch: [roleGuard(['admin'])],
        loadComponent: () => import('./user-list').then((m) => m.UserList),
        title: 'Accounts — Padside console',
      },
      {
        path: 'orders',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./orders/order-list').then((m) => m.OrderList),
        title: 'Orders — Padside console',
      },
      {
        path: 'orders/:id',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./orders/order-detail').then((m) => m.OrderDetail),
        title: 'Order — Padside console',
      },
      {
        path: 'runs',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./runs/run-list').then((m) => m.RunList),
        title: 'Runs — Padside console',
      },
      {
        path: 'runs/:id/print-sheet',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./runs/print-sheet').then((m) => m.PrintSheetPage),
        title: 'Print-run sheet — Padside console',
      },
      {
        path: 'products',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./runs/product-admin').then((m) => m.ProductAdmin),
        title: 'Products — Padside console',
      },
      {
        path: 'shop-settings',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./shop-settings/shop-settings').then((m) => m.ShopSettingsPage),
        title: 'Shop settings — Padside console',
      },
      {
        path: 'members',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadChildren: () => import('./members/members.routes').then((m) => m.membersRoutes),
      },
      {
        path: 'check-in',
        loadComponent: () => import('./check-in/check-in').then((m) => m.CheckIn),
        title: 'Launch check-in — Padside console',
      },
      {
        path: 'posts',
        canMatch: [roleGuard(['editor', 'admin'])],
        loadComponent: () => import('./posts/post-table').then((m) => m.PostTable),
        title: 'Build logs — Padside console',
      },
      {
        path: 'posts/:id',
        canMatch: [roleGuard(['editor', 'admin'])],
        loadComponent: () => import('./posts/post-editor').then((m) => m.PostEditor),
        title: 'Edit build log — Padside console',
      },
      {
        path: 'sponsors',
        loadComponent: () => import('./sponsors/sponsor-table').then((m) => m.SponsorTable),
        title: 'Sponsors — Padside console',
      },
      {
        path: 'sponsors/:id',
        loadComponent: () => import('./sponsors/sponsor-detail').then((m) => m.SponsorDetail),
        title: 'Sponsor — Padside console',
      },
      {
        path: 'launches',
        canMatch: [roleGuard(['range_officer', 'admin'])],
        loadComponent: () => import('../launches/console/launch-admin').then((m) => m.LaunchAdmin),
        title: 'Launch days — Padside console',
      },
      {
        path: 'launch-settings',
        canMatch: [roleGuard(['range_officer', 'admin'])],
        loadComponent: () => import('../launches/console/certification-classes').then((m) => m.CertificationClasses),
        title: 'Certification classes — Padside console',
      },
      {
        path: 'range',
        canMatch: [roleGuard(['range_officer', 'admin'])],
        loadComponent: () => import('../launches/console/range-table').then((m) => m.RangeTable),
        title: 'Range table — Padside console',
      },
      {
        path: 'range/:id',
        canMatch: [roleGuard(['range_officer', 'admin'])],
        loadComponent: () => import('../launches/console/range-table').then((m) => m.RangeTable),
        title: 'Range table — Padside console',
      },
      {
        path: 'announcements',
        canMatch: [roleGuard(['editor', 'admin'])],
        loadComponent: () => import('./announcements/announcement-list').then((m) => m.AnnouncementList),
        title: 'Announcements — Padside console',
      },
      {
        path: 'announcements/:id',
        canMatch: [roleGuard(['editor', 'admin'])],
        loadComponent: () => import('./announcements/announcement-editor').then((m) => m.AnnouncementEditor),
        title: 'Announcement — Padside console',
      },
      {
        path: 'books',
        canMatch: [roleGuard(['treasurer', 'admin'])],
        loadComponent: () => import('./books/books-page').then((m) => m.BooksPage),
        title: 'Books — Padside console',
      },
    ],
  },
];
