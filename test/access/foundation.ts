import type { RouteAccess } from './access-types';

/** Routes of the foundation: health, site names, auth, account, accounts admin, uploads. */
export const foundationAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/health', allow: 'public' },
  { method: 'GET', path: '/api/site', allow: 'public' },
  { method: 'GET', path: '/api/auth/csrf', allow: 'public' },
  { method: 'POST', path: '/api/auth/register', allow: 'public' },
  { method: 'POST', path: '/api/auth/login', allow: 'public' },
  { method: 'POST', path: '/api/auth/logout', allow: 'public' },
  { method: 'GET', path: '/api/auth/me', allow: 'public' },
  { method: 'POST', path: '/api/auth/verify', allow: 'public' },
  { method: 'POST', path: '/api/auth/verify/resend', allow: 'signedIn' },
  { method: 'POST', path: '/api/auth/password-reset', allow: 'public' },
  { method: 'POST', path: '/api/auth/password-reset/confirm', allow: 'public' },
  { method: 'GET', path: '/api/account/profile', allow: 'signedIn' },
  { method: 'PATCH', path: '/api/account/profile', allow: 'signedIn' },
  { method: 'POST', path: '/api/account/password', allow: 'signedIn' },
  { method: 'GET', path: '/api/admin/users', allow: ['admin'] },
  { method: 'PATCH', path: '/api/admin/users/:id', allow: ['admin'] },
  { method: 'DELETE', path: '/api/admin/users/:id/sign-in-lock', allow: ['admin'] },
  { method: 'GET', path: '/api/admin/users/:id/history', allow: ['admin'] },
  { method: 'POST', path: '/api/admin/users/:id/disable', allow: ['admin'] },
  { method: 'POST', path: '/api/admin/users/:id/enable', allow: ['admin'] },
  { method: 'POST', path: '/api/admin/uploads', allow: ['editor', 'treasurer', 'admin'] },
  { method: 'DELETE', path: '/api/admin/uploads/:key', allow: ['editor', 'treasurer', 'admin'] },
  { method: 'GET', path: '/uploads/:key', allow: 'public' },
];
