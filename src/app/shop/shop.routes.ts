import { Routes } from '@angular/router';
import { paramShape, productSlug } from '../core/rendering/param-shape';
import { sessionKnown, signedInGuard } from '../core/role-guard';

export const shopRoutes: Routes = [
  { path: '', loadComponent: () => import('./product-grid').then((m) => m.ProductGrid), title: 'Merch — Padside' },
  {
    path: 'p/:slug',
    canMatch: [paramShape('slug', productSlug)],
    loadComponent: () => import('./product-page').then((m) => m.ProductPage),
    title: 'Merch — Padside',
  },
  { path: 'cart', loadComponent: () => import('./cart-page').then((m) => m.CartPage), title: 'Your cart — Padside' },
  // The contact step starts from the signed-in buyer's name and e-mail.
  {
    path: 'checkout',
    canMatch: [sessionKnown],
    loadComponent: () => import('./checkout').then((m) => m.Checkout),
    title: 'Checkout — Padside',
  },
  // Full match: a prefix match would send /shop/orders/:id (a guest's confirmation) through the sign-in guard.
  {
    path: 'orders',
    pathMatch: 'full',
    canMatch: [signedInGuard],
    loadComponent: () => import('./my-orders').then((m) => m.MyOrders),
    title: 'My orders — Padside',
  },
  {
    path: 'orders/:id',
    loadComponent: () => import('./order-page').then((m) => m.OrderPage),
    title: 'Order — Padside',
  },
];
