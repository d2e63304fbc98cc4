import { Routes } from '@angular/router';
import { roleGuard } from '../core/role-guard';
import { PlaceholderPage } from '../shared/placeholder-page';
import { ConsoleFrame } from './console-frame';

const later = (heading: string, text: string) => ({ component: PlaceholderPage, data: { heading, text }, title: `${heading} — Padside console` });

export const adminRoutes: Routes = [
  {
    path: '',
    component: ConsoleFrame,
    children: [
      { path: '', pathMatch: 'full', ...later('Overview', 'The treasurer’s dashboard (sales, dues, tax to remit, overdue sponsor credits) arrives with the books work (issue 6).') },
      { path: 'users', canMatch: [roleGuard(['admin'])], loadComponent: () => import('./user-list').then((m) => m.UserList), title: 'Accounts — Padside console' },
      { path: 'orders', ...later('Orders', 'Orders, fulfilment, refunds and print-run sheets arrive with the storefront work (issue 3).') },
      { path: 'members', ...later('Members', 'The roster, dues payments and launch-day check-in arrive with the membership work (issue 4).') },
      { path: 'posts', ...later('Build logs', 'The post editor arrives with the build-log and sponsor work (issue 5).') },
      { path: 'sponsors', ...later('Sponsors', 'Sponsors, agreements and the credit ledger arrive with the build-log and sponsor work (issue 5).') },
      { path: 'books', ...later('Books', 'Tax to remit, processor fees and the ledger export arrive with the books work (issue 6).') },
    ],
  },
];
