import { inject } from '@angular/core';
import { CanMatchFn, Router } from '@angular/router';
import { SessionStore } from './session-store';
import { STAFF_ROLES, type Role } from './user';

/** Lets the route match only for users with one of the roles; others go to sign-in (the server refuses them anyway). */
export function roleGuard(roles: readonly Role[]): CanMatchFn {
  return (_route, segments) => {
    const session = inject(SessionStore);
    if (session.hasAnyRole(roles)) return true;
    const router = inject(Router);
    const returnTo = '/' + segments.map((s) => s.path).join('/');
    return session.signedIn() ? router.parseUrl('/account/no-access') : router.createUrlTree(['/account/sign-in'], { queryParams: { returnTo } });
  };
}

export const staffGuard = roleGuard(STAFF_ROLES);
export const signedInGuard: CanMatchFn = (_route, segments) => {
  if (inject(SessionStore).signedIn()) return true;
  return inject(Router).createUrlTree(['/account/sign-in'], { queryParams: { returnTo: '/' + segments.map((s) => s.path).join('/') } });
};
