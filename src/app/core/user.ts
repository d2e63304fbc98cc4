import type { Role } from '@contracts/labels/roles';

/** Roles as the server names them (their labels are `ROLE_LABELS` in the same module). */
export type { Role };

/** Roles that see the console (each sees only its own sections there). */
export const STAFF_ROLES: readonly Role[] = ['editor', 'treasurer', 'admin', 'range_officer'];

/** The signed-in user, as `/api/auth/me` returns it. */
export type { User } from '@contracts/account/account-answers';

/** The error body every API failure carries. */
export type { ApiErrorBody } from '@contracts/forms/error-answer';
