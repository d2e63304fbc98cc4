/** What the account and sign-in routes answer about the signed-in person: the server types them with these; the app
 * reads them. */
import type { Role } from '../labels/roles';

/** The signed-in user, as every route sees it and as `/api/auth/me` returns it. */
export interface User {
  id: number;
  email: string;
  displayName: string;
  roles: Role[];
  emailVerified: boolean;
}

/** GET /api/account/profile: the person and their choice about marketing mail. */
export interface Profile {
  user: User;
  marketingOptOut: boolean;
}
