import type { RouteAccess } from './access-types';

const TREASURY = ['treasurer', 'admin'] as const;

/** The treasurer's books. */
export const booksAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/admin/reports/tax', allow: TREASURY },
  { method: 'GET', path: '/api/admin/reports/tax.csv', allow: TREASURY },
  { method: 'GET', path: '/api/admin/reports/revenue', allow: TREASURY },
  { method: 'GET', path: '/api/admin/reports/ledger.csv', allow: TREASURY },
  { method: 'GET', path: '/api/admin/reports/units-by-size', allow: TREASURY },
  { method: 'GET', path: '/api/admin/reports/sponsor-value', allow: TREASURY },
  { method: 'GET', path: '/api/admin/dashboard', allow: TREASURY },
  { method: 'GET', path: '/api/admin/settings/processor-fees', allow: TREASURY },
  { method: 'PUT', path: '/api/admin/settings/processor-fees', allow: TREASURY },
];
