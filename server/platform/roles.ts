import type { User } from '../../contracts/account/account-answers';
import { ROLES, type Role } from '../../contracts/labels/roles';

/** Every role an account can hold. `member` follows dues status; the others are granted by an admin. */
export { ROLES, type Role };

/** Staff roles see the console. (Range officers see its launch pages only; the client lists them there.) */
export const STAFF_ROLES: readonly Role[] = ['editor', 'treasurer', 'admin'];

/** The signed-in user as every route sees it (and as the app gets it). */
export type SessionUser = User;
