import type { RouteAccess } from './access-types';

/** Routes of the build logs: public reading, feeds, and the editors' console. */
export const buildLogsAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/posts', allow: 'public' },
  { method: 'GET', path: '/api/posts/tags', allow: 'public' },
  { method: 'GET', path: '/api/posts/:slug', allow: 'public' },
  { method: 'GET', path: '/api/admin/posts', allow: ['editor', 'admin'] },
  { method: 'POST', path: '/api/admin/posts', allow: ['editor', 'admin'] },
  { method: 'POST', path: '/api/admin/posts/preview', allow: ['editor', 'admin'] },
  { method: 'GET', path: '/api/admin/posts/:id', allow: ['editor', 'admin'] },
  { method: 'PUT', path: '/api/admin/posts/:id', allow: ['editor', 'admin'] },
  { method: 'GET', path: '/feeds/build-logs.rss', allow: 'public' },
  { method: 'GET', path: '/feeds/build-logs.atom', allow: 'public' },
];
