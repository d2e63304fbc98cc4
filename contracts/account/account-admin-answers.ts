/** What the admins' account routes answer (/api/admin/users): the server types its views with these; the console
 * reads them. Times are ISO instants. */
import type { Role } from '../labels/roles';
import type { User } from './account-answers';

/** Consecutive failed sign-ins on an account, and whether they locked it. */
export interface SignInLock {
  failures: number;
  locked: boolean;
}

/** An account as admins see it: the session view plus whether it is disabled or was deleted by its owner. */
export type AdminAccount = User & { disabledAt: string | null; deletedAt: string | null };

/** An account in the admins' list: its admin view, when it was made and where its sign-in failures stand. */
export type ListedAccount = AdminAccount & { createdAt: string; signIn: SignInLock };

/** GET /api/admin/users. `deletedAt`: the owner deleted the account; the row stays (orders and dues point at it)
 * under a neutral name. */
export interface AccountPage {
  items: ListedAccount[];
  total: number;
  page: number;
  pageSize: number;
}

/** One change of an account's roles or state. */
export interface AccountChange {
  id: number;
  kind: 'roles' | 'disabled' | 'enabled';
  added: Role[];
  removed: Role[];
  at: string;
  by: { id: number; name: string } | null;
}
