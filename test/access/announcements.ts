import type { RouteAccess } from './access-types';

/** Editors and admins compose and send announcements. */
const COMPOSERS = ['editor', 'admin'] as const;

/** Routes of announcements: public sign-up and unsubscribe, the person's own lists, the staff console. */
export const announcementsAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/subscriptions/wording', allow: 'public' },
  { method: 'POST', path: '/api/subscriptions', allow: 'public' },
  { method: 'GET', path: '/api/subscriptions/confirm', allow: 'public' },
  { method: 'GET', path: '/api/subscriptions/unsubscribe', allow: 'public' },
  { method: 'POST', path: '/api/subscriptions/unsubscribe', allow: 'public' },
  { method: 'GET', path: '/api/account/subscriptions', allow: 'signedIn' },
  { method: 'GET', path: '/api/admin/announcements', allow: COMPOSERS },
  { method: 'POST', path: '/api/admin/announcements', allow: COMPOSERS },
  { method: 'GET', path: '/api/admin/announcements/settings', allow: COMPOSERS },
  { method: 'PUT', path: '/api/admin/announcements/settings', allow: ['admin'] },
  { method: 'GET', path: '/api/admin/announcements/:id', allow: COMPOSERS },
  { method: 'PATCH', path: '/api/admin/announcements/:id', allow: COMPOSERS },
  { method: 'GET', path: '/api/admin/announcements/:id/preview', allow: COMPOSERS },
  { method: 'POST', path: '/api/admin/announcements/:id/test', allow: COMPOSERS },
  { method: 'POST', path: '/api/admin/announcements/:id/send', allow: COMPOSERS },
];
