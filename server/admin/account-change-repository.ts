import type { Knex } from 'knex';
import type { Role } from '../platform/roles';

export type AccountChangeKind = 'roles' | 'disabled' | 'enabled';

export interface AccountChangeRow {
  id: number;
  kind: AccountChangeKind;
  roles_before: Role[];
  roles_after: Role[];
  changed_at: Date;
  changed_by: number | null;
  changed_by_name: string | null;
}

/** The history of role changes and disabling, and the session rows an account holds. */
export class AccountChangeRepository {
  constructor(private readonly db: Knex) {}

  /** Appends one change to an account's history inside the caller's transaction, so the change and its record commit together. */
  async record(
    trx: Knex.Transaction,
    c: { userId: number; changedBy: number | null; kind: AccountChangeKind; rolesBefore: Role[]; rolesAfter: Role[] },
  ): Promise<void> {
    await trx('account_changes').insert({
      user_id: c.userId,
      changed_by: c.changedBy,
      kind: c.kind,
      roles_before: c.rolesBefore,
      roles_after: c.rolesAfter,
    });
  }

  /** Newest first, with the name of whoever made each change. */
  history(userId: number, limit: number): Promise<AccountChangeRow[]> {
    return this.db('account_changes as c')
      .leftJoin('users as by', 'by.id', 'c.changed_by')
      .where('c.user_id', userId)
      .select(
        'c.id',
        'c.kind',
        'c.roles_before',
        'c.roles_after',
        'c.changed_at',
        'c.changed_by',
        'by.display_name as changed_by_name',
      )
      .orderBy([
        { column: 'c.changed_at', order: 'desc' },
        { column: 'c.id', order: 'desc' },
      ])
      .limit(limit);
  }

  /** Ends every session of the account: passport keeps the user id at `sess.passport.user`. */
  async endSessions(trx: Knex.Transaction, userId: number): Promise<number> {
    return trx('session')
      .whereRaw("(sess -> 'passport' ->> 'user') = ?", [String(userId)])
      .delete();
  }

  /** The row, locked for the rest of the transaction, so two admins' clicks apply one after the other. */
  lockUser(
    trx: Knex.Transaction,
    id: number,
  ): Promise<{ id: number; roles: Role[]; disabled_at: Date | null; deleted_at: Date | null } | undefined> {
    return trx('users').where('id', id).forUpdate().first('id', 'roles', 'disabled_at', 'deleted_at');
  }
}
