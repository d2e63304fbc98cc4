/** Who calls a route in the access test. */
export const CALLERS = [
  'anonymous',
  'fan',
  'member',
  'sponsor',
  'editor',
  'treasurer',
  'admin',
  'range_officer',
] as const;
export type Caller = (typeof CALLERS)[number];

/**
 * One route and who may use it. `allow` lists the callers that get past the access check; everyone else must be
 * answered 401 (anonymous) or 403 (signed in). `public` routes answer everyone; `signedIn` any signed-in caller.
 * `owner` routes belong to one resource's owner (and `ownerOr` roles): everyone else, signed in or not, gets the same
 * 404 as an id that does not exist (ASVS 4.0.3 4.2.1), checked with real owners in test/api/access-scopes.test.ts.
 */
export interface RouteAccess {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  allow: 'public' | 'signedIn' | 'owner' | readonly Caller[];
  /** With `owner`: the roles that may use the route on anyone's resource. */
  ownerOr?: readonly Caller[];
}

export const STAFF: readonly Caller[] = ['editor', 'treasurer', 'admin'];
