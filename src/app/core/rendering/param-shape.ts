import type { CanMatchFn } from '@angular/router';

/**
 * A route matches only when its `:name` segment has the shape the API accepts; otherwise the router goes on to the
 * not-found page (status 404), instead of asking the API and showing its 400 for an address that can never exist.
 */
export function paramShape(name: string, fits: (value: string) => boolean): CanMatchFn {
  return (route, segments) => {
    const at = (route.path ?? '').split('/').indexOf(`:${name}`);
    const value = at < 0 ? undefined : segments[at]?.path;
    return value !== undefined && fits(value);
  };
}

/** A record id: a positive whole number, no sign or leading zero, within PostgreSQL's `integer` (2^31 - 1, from memory). */
export const recordId = (value: string): boolean => /^[1-9][0-9]{0,9}$/.test(value) && Number(value) <= 2_147_483_647;

/** A product address as the shop API accepts it (`server/shop/shop-routes.ts`). */
export const productSlug = (value: string): boolean => /^[a-z0-9-]{1,80}$/.test(value);

/** A build log address as posts are given one (`PostBody` in `server/build-logs/post-schemas.ts`). */
export const postSlug = (value: string): boolean => /^[a-z0-9][a-z0-9-]{0,119}$/.test(value);
