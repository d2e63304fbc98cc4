import type { RouteAccess } from './access-types';

/** Range officers and admins (admins can do everything a range officer can). */
const RANGE = ['range_officer', 'admin'] as const;

/** Routes of launch days and flights: the public calendar and feed, RSVPs, flight cards, the range table. */
export const launchesAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/launches', allow: 'public' },
  { method: 'GET', path: '/api/launches/:id', allow: 'public' },
  { method: 'GET', path: '/api/launches/:id/results', allow: 'public' },
  { method: 'POST', path: '/api/launches/:id/rsvp', allow: 'signedIn' },
  { method: 'POST', path: '/api/launches/:id/check-in', allow: RANGE },
  { method: 'POST', path: '/api/launches/:id/flights', allow: 'signedIn' },
  { method: 'GET', path: '/api/admin/launches', allow: RANGE },
  { method: 'POST', path: '/api/admin/launches', allow: RANGE },
  { method: 'GET', path: '/api/admin/launches/settings', allow: RANGE },
  { method: 'PUT', path: '/api/admin/launches/settings', allow: RANGE },
  { method: 'PATCH', path: '/api/admin/launches/:id', allow: RANGE },
  { method: 'POST', path: '/api/admin/launches/:id/call-off', allow: RANGE },
  { method: 'POST', path: '/api/admin/launches/:id/done', allow: RANGE },
  { method: 'GET', path: '/api/admin/launches/:id/attendance', allow: RANGE },
  { method: 'GET', path: '/api/admin/launches/:id/queue', allow: RANGE },
  { method: 'GET', path: '/api/flights/:id', allow: 'public' },
  { method: 'POST', path: '/api/flights/:id/data', allow: 'signedIn' },
  { method: 'POST', path: '/api/admin/flights/:id/decision', allow: RANGE },
  { method: 'POST', path: '/api/admin/flights/:id/outcome', allow: RANGE },
  { method: 'GET', path: '/api/account/flights', allow: 'signedIn' },
  { method: 'GET', path: '/feeds/launches.ics', allow: 'public' },
];
