/** Who calls a route in the access test. */
export const CALLERS = ['anonymous', 'fan', 'member', 'sponsor', 'editor', 'treasurer', 'admin', 'range_officer'] as const;
export type Caller = (typeof CALLERS)[number];

/**
 * One route and who may use it. `allow` lists the callers that get past the access check; everyone else must be
 * answered 401 (anonymous) or 403 (signed in). `public` routes answer everyone; `signedIn` any signed-in caller.
 */
export interface RouteAccess {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  allow: 'public' | 'signedIn' | readonly Caller[];
}

export const STAFF: readonly Caller[] = ['editor', 'treasurer', 'admin'];
