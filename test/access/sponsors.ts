import { STAFF, type RouteAccess } from './access-types';

const MONEY = ['treasurer', 'admin'] as const;

/** Routes of the sponsors: the public list, the staff ledger, and the sponsor's own portal. */
export const sponsorsAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/sponsors', allow: 'public' },
  { method: 'GET', path: '/api/sponsors/wall', allow: 'public' },
  { method: 'GET', path: '/api/admin/sponsors', allow: STAFF },
  { method: 'POST', path: '/api/admin/sponsors', allow: STAFF },
  { method: 'GET', path: '/api/admin/sponsors/tiers', allow: STAFF },
  { method: 'PUT', path: '/api/admin/sponsors/tiers', allow: MONEY },
  { method: 'GET', path: '/api/admin/sponsors/overdue', allow: STAFF },
  { method: 'POST', path: '/api/admin/sponsors/agreements/:agreementId/cash-received', allow: MONEY },
  { method: 'PUT', path: '/api/admin/sponsors/agreements/:agreementId/tax-treatment', allow: MONEY },
  { method: 'GET', path: '/api/admin/sponsors/agreements/:agreementId/invoice.pdf', allow: MONEY },
  { method: 'GET', path: '/api/admin/sponsors/:id', allow: STAFF },
  { method: 'PUT', path: '/api/admin/sponsors/:id', allow: STAFF },
  { method: 'POST', path: '/api/admin/sponsors/:id/agreements', allow: MONEY },
  { method: 'GET', path: '/api/admin/sponsors/:id/ledger', allow: STAFF },
  { method: 'GET', path: '/api/admin/sponsors/:id/ledger.csv', allow: STAFF },
  { method: 'POST', path: '/api/admin/sponsors/:id/credits', allow: STAFF },
  { method: 'POST', path: '/api/admin/sponsors/:id/contacts', allow: MONEY },
  { method: 'DELETE', path: '/api/admin/sponsors/:id/contacts/:userId', allow: MONEY },
  { method: 'GET', path: '/api/sponsor-portal/me', allow: ['sponsor'] },
  { method: 'GET', path: '/api/sponsor-portal/report.csv', allow: ['sponsor'] },
  { method: 'GET', path: '/api/sponsor-portal/report.pdf', allow: ['sponsor'] },
];
