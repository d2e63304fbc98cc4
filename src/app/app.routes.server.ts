import { RenderMode, type ServerRoute } from '@angular/ssr';

/** The public pages people share and search engines read: rendered on the server, as a visitor. */
const PUBLIC = [
  '',
  'shop',
  'shop/p/:slug',
  'build-logs',
  'build-logs/:slug',
  'sponsors',
  'launches',
  'launches/:id',
  'privacy',
];

/**
 * Personal pages (console, account, cart and checkout, orders, dues, the sponsor portal) and the pages a mailed link
 * opens with its token (confirming or stopping a list): browser only.
 */
const PERSONAL = [
  'console/**',
  'account/**',
  'membership/**',
  'subscriptions/**',
  'shop/cart',
  'shop/checkout',
  'shop/orders',
  'shop/orders/**',
  'sponsors/portal',
  'launches/flights/:id',
  'launches/:id/results',
  'launches/:id/card',
];

/**
 * Which pages the server renders and which stay client-rendered. Any other address is the not-found page, rendered
 * on the server with status 404; a product, post or launch day that does not exist sets its own 404 (`load-error-status.ts`).
 */
export const serverRoutes: ServerRoute[] = [
  ...PUBLIC.map((path): ServerRoute => ({ path, renderMode: RenderMode.Server })),
  ...PERSONAL.map((path): ServerRoute => ({ path, renderMode: RenderMode.Client })),
  { path: '**', renderMode: RenderMode.Server, status: 404 },
];
