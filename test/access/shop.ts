import type { RouteAccess } from './access-types';

const SHOP_STAFF = ['treasurer', 'admin'] as const;

/** Routes of the merch shop: storefront, checkout, the buyer's orders, staff fulfilment and the payment webhook. */
export const shopAccess: RouteAccess[] = [
  { method: 'GET', path: '/api/products', allow: 'public' },
  { method: 'GET', path: '/api/products/:slug', allow: 'public' },
  { method: 'GET', path: '/api/shipping-methods', allow: 'public' },
  { method: 'POST', path: '/api/checkout/quote', allow: 'public' },
  { method: 'POST', path: '/api/orders', allow: 'public' },
  // Its buyer (signed in, or the guest's own session), the treasurer and the admin; anyone else gets 404.
  { method: 'GET', path: '/api/orders/:id', allow: 'owner', ownerOr: SHOP_STAFF },
  { method: 'POST', path: '/api/orders/:id/pay', allow: 'owner', ownerOr: SHOP_STAFF },
  { method: 'GET', path: '/api/account/orders', allow: 'signedIn' },
  { method: 'GET', path: '/api/admin/orders', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/orders/export', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/orders/:id', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/orders/:id/pack', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/orders/:id/ship', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/orders/:id/refund', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/orders/:id/refund-preview', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/products', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/products', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/products/:id', allow: SHOP_STAFF },
  { method: 'PATCH', path: '/api/admin/products/:id', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/runs', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/runs', allow: SHOP_STAFF },
  { method: 'POST', path: '/api/admin/runs/:id/state', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/runs/:id/print-sheet', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/runs/:id/print-sheet.csv', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/shop/settings', allow: SHOP_STAFF },
  { method: 'PUT', path: '/api/admin/shop/settings', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/shop/shipping-methods', allow: SHOP_STAFF },
  { method: 'PUT', path: '/api/admin/shop/shipping-methods/:id', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/admin/shop/tax-rates', allow: SHOP_STAFF },
  { method: 'GET', path: '/api/payments/card-entry', allow: 'public' },
  { method: 'POST', path: '/api/payments/webhook', allow: 'public' },
];
