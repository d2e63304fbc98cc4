import type { RouteAccess } from './access-types';

const TREASURY = ['treasurer', 'admin'] as const;

/** Routes of club membership: the member's own side, the treasurer's roster and launch-day check-in. */
export const membershipAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/membership/plans', allow: 'public' },
  { method: 'GET', path: '/api/membership/policy', allow: 'public' },
  { method: 'POST', path: '/api/membership/quote', allow: 'public' },
  { method: 'POST', path: '/api/membership', allow: 'signedIn' },
  { method: 'GET', path: '/api/membership/me', allow: 'signedIn' },
  { method: 'PATCH', path: '/api/membership/me', allow: 'signedIn' },
  { method: 'POST', path: '/api/membership/renew', allow: 'signedIn' },
  { method: 'POST', path: '/api/membership/auto-renew', allow: 'signedIn' },
  { method: 'GET', path: '/api/membership/card', allow: 'signedIn' },
  { method: 'GET', path: '/api/admin/members', allow: TREASURY },
  { method: 'GET', path: '/api/admin/members/export.csv', allow: TREASURY },
  { method: 'GET', path: '/api/admin/members/summary', allow: TREASURY },
  { method: 'POST', path: '/api/admin/members/email', allow: TREASURY },
  { method: 'GET', path: '/api/admin/members/plans', allow: TREASURY },
  { method: 'POST', path: '/api/admin/members/plans', allow: TREASURY },
  { method: 'PATCH', path: '/api/admin/members/plans/:id', allow: TREASURY },
  { method: 'GET', path: '/api/admin/members/settings', allow: TREASURY },
  { method: 'PUT', path: '/api/admin/members/settings', allow: TREASURY },
  { method: 'GET', path: '/api/admin/members/:id', allow: TREASURY },
  { method: 'PATCH', path: '/api/admin/members/:id', allow: TREASURY },
  { method: 'POST', path: '/api/admin/members/:id/verifications', allow: TREASURY },
  { method: 'DELETE', path: '/api/admin/members/:id/verifications/:what', allow: TREASURY },
  { method: 'POST', path: '/api/admin/members/:id/payments', allow: TREASURY },
  { method: 'POST', path: '/api/admin/members/:id/refunds', allow: TREASURY },
  { method: 'POST', path: '/api/admin/checkin', allow: ['editor', 'treasurer', 'admin'] },
];
