import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { SessionStore } from './session-store';
import { STAFF_ROLES, type Role } from './user';

/** Lets the route match only for users with one of the roles; others go to sign-in (the server refuses them anyway). */
export function roleGuard(roles: readonly Role[]): CanMatchFn {
  return async (_route, segments) => {
    const session = inject(SessionStore);
    const router = inject(Router);
    await session.ready;
    if (session.hasAnyRole(roles)) return true;
    const returnTo = '/' + segments.map((s) => s.path).join('/');
    return session.signedIn()
      ? router.parseUrl('/account/no-access')
      : router.createUrlTree(['/account/sign-in'], { queryParams: { returnTo } });
  };
}

export const staffGuard = roleGuard(STAFF_ROLES);
export const signedInGuard: CanMatchFn = async (_route, segments) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  await session.ready;
  if (session.signedIn()) return true;
  return router.createUrlTree(['/account/sign-in'], {
    queryParams: { returnTo: '/' + segments.map((s) => s.path).join('/') },
  });
};

/** Lets a page that fills its form from the signed-in person (checkout) wait until the session is known. */
export const sessionKnown: CanMatchFn = async () => {
  await inject(SessionStore).ready;
  return true;
};
