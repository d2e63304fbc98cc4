import type { Role } from '../core/user';

/** One entry of the console's side navigation, shown to the roles that may use it. */
export interface ConsoleLink {
  path: string;
  label: string;
  icon: string;
  roles: readonly Role[];
  /**
   * Opened with a full page load: the server grants the camera only to a document loaded at this path (the check-in
   * and range table scan member cards; Permissions-Policy is fixed for a document's lifetime).
   */
  fullLoad?: true;
}

export const CONSOLE_LINKS: readonly ConsoleLink[] = [
  {
    path: '/console',
    label: 'Overview',
    icon: 'space_dashboard',
    roles: ['editor', 'treasurer', 'admin', 'range_officer'],
  },
  { path: '/console/launches', label: 'Launch days', icon: 'rocket_launch', roles: ['range_officer', 'admin'] },
  { path: '/console/range', label: 'Range table', icon: 'flag', roles: ['range_officer', 'admin'], fullLoad: true },
  {
    path: '/console/launch-settings',
    label: 'Certification classes',
    icon: 'workspace_premium',
    roles: ['range_officer', 'admin'],
  },
  { path: '/console/orders', label: 'Orders', icon: 'local_shipping', roles: ['treasurer', 'admin'] },
  { path: '/console/runs', label: 'Runs', icon: 'checkroom', roles: ['treasurer', 'admin'] },
  { path: '/console/products', label: 'Products', icon: 'sell', roles: ['treasurer', 'admin'] },
  { path: '/console/shop-settings', label: 'Shop settings', icon: 'tune', roles: ['treasurer', 'admin'] },
  { path: '/console/members', label: 'Members', icon: 'badge', roles: ['treasurer', 'admin'] },
  {
    path: '/console/check-in',
    label: 'Check-in',
    icon: 'qr_code_scanner',
    roles: ['editor', 'treasurer', 'admin'],
    fullLoad: true,
  },
  { path: '/console/posts', label: 'Build logs', icon: 'edit_note', roles: ['editor', 'admin'] },
  { path: '/console/announcements', label: 'Announcements', icon: 'campaign', roles: ['editor', 'admin'] },
  { path: '/console/sponsors', label: 'Sponsors', icon: 'handshake', roles: ['editor', 'treasurer', 'admin'] },
  { path: '/console/books', label: 'Books', icon: 'account_balance', roles: ['treasurer', 'admin'] },
  { path: '/console/users', label: 'Accounts', icon: 'manage_accounts', roles: ['admin'] },
];
