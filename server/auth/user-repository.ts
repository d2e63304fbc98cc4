import type { Knex } from 'knex';
import type { Role, SessionUser } from '../platform/roles';

export interface UserRow {
  id: number;
  email: string;
  password_hash: string;
  display_name: string;
  roles: Role[];
  email_verified_at: Date | null;
  marketing_opt_out: boolean;
  /** Set when the owner deleted the account: the row stays as a tombstone (orders and dues point at it). */
  deleted_at: Date | null;
  /** Set while an admin has the account disabled: no sign-in, no session. */
  disabled_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

/** The session's copy of a user: just what requests check (id, roles, verified), never the password hash. */
export function toSessionUser(row: UserRow): SessionUser {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    roles: row.roles,
    emailVerified: row.email_verified_at !== null,
  };
}

/** What a person's download and deletion need of their account. */
type LiveAccount = Pick<UserRow, 'id' | 'email' | 'email_verified_at'>;

/** Plain reads and writes of `users`. */
export class UserRepository {
  constructor(private readonly db: Knex) {}

  /** The account with this e-mail, compared in lower case as it is stored. */
  byEmail(email: string, db: Knex = this.db): Promise<UserRow | undefined> {
    return db<UserRow>('users').where('email', email.toLowerCase()).first();
  }

  /** The account row with this id, deleted and disabled ones included; callers decide what those may do. */
  byId(id: number, db: Knex = this.db): Promise<UserRow | undefined> {
    return db<UserRow>('users').where('id', id).first();
  }

  /** Creates an account with its e-mail in lower case and the fan role unless told otherwise. */
  async insert(
    trx: Knex.Transaction,
    user: { email: string; passwordHash: string; displayName: string; roles?: Role[] },
  ): Promise<UserRow> {
    const [row] = await trx<UserRow>('users')
      .insert({
        email: user.email.toLowerCase(),
        password_hash: user.passwordHash,
        display_name: user.displayName,
        roles: user.roles ?? ['fan'],
      })
      .returning('*');
    return row;
  }

  /** Writes the given account columns and the update time in the caller's transaction. */
  async update(
    trx: Knex.Transaction,
    id: number,
    patch: Partial<
      Pick<
        UserRow,
        'password_hash' | 'display_name' | 'roles' | 'email_verified_at' | 'marketing_opt_out' | 'disabled_at'
      >
    >,
  ): Promise<UserRow | undefined> {
    const [row] = await trx<UserRow>('users')
      .where('id', id)
      .update({ ...patch, updated_at: trx.fn.now() as unknown as Date })
      .returning('*');
    return row;
  }

  /** The account's address and verification, if it is not deleted. */
  async live(trx: Knex.Transaction, id: number): Promise<LiveAccount | undefined> {
    return trx('users').where('id', id).whereNull('deleted_at').first('id', 'email', 'email_verified_at');
  }

  /** The same, with the row locked for the transaction (an account's deletion), so nothing else writes it. */
  async lockLive(trx: Knex.Transaction, id: number): Promise<LiveAccount | undefined> {
    return trx('users').where('id', id).whereNull('deleted_at').forUpdate().first('id', 'email', 'email_verified_at');
  }

  /** The ids of every live admin, locked in id order so two admins deleting themselves at once take turns. */
  async lockAdmins(trx: Knex.Transaction): Promise<number[]> {
    return trx('users').whereRaw("'admin' = ANY(roles)").whereNull('deleted_at').orderBy('id').forUpdate().pluck('id');
  }

  /**
   * Adds or removes one role that a rule drives (dues in good standing give `member`); a change that happens goes
   * into the account's history as made by no person, so admins see why the role came or went.
   */
  async setRole(trx: Knex.Transaction, id: number, role: Role, present: boolean): Promise<void> {
    const next = present
      ? '(SELECT array_agg(DISTINCT r) FROM unnest(array_append(u.roles, ?::text)) r)'
      : 'array_remove(u.roles, ?::text)';
    await trx.raw(
      `WITH before AS (SELECT id, roles FROM users WHERE id = ? FOR UPDATE),
            after AS (UPDATE users u SET roles = ${next}, updated_at = now() FROM before b WHERE u.id = b.id RETURNING u.id, u.roles)
       INSERT INTO account_changes (user_id, changed_by, kind, roles_before, roles_after)
       SELECT a.id, NULL, 'roles', b.roles, a.roles FROM before b JOIN after a ON a.id = b.id
       WHERE NOT (b.roles @> a.roles AND a.roles @> b.roles)`,
      [id, role],
    );
  }

  /** One page of accounts for the admin list, filtered by text, role and disabled state, with the total for the pager. */
  async page(opts: {
    q?: string;
    role?: Role;
    disabled?: boolean;
    page: number;
    pageSize: number;
  }): Promise<{ items: UserRow[]; total: number }> {
    const base = this.db<UserRow>('users').modify((qb) => {
      if (opts.q) qb.where((w) => w.whereILike('email', `%${opts.q}%`).orWhereILike('display_name', `%${opts.q}%`));
      if (opts.role) qb.whereRaw('? = ANY(roles)', [opts.role]);
      if (opts.disabled !== undefined)
        qb.where((w) => (opts.disabled ? w.whereNotNull('disabled_at') : w.whereNull('disabled_at')));
    });
    const [{ count }] = await base.clone().count<{ count: number }[]>({ count: '*' });
    const items = await base
      .clone()
      .orderBy('id')
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize);
    return { items, total: count };
  }
}
