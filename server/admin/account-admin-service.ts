import type { Knex } from 'knex';
import type { SignInGuard } from '../auth/sign-in-guard';
import { toSessionUser, type UserRepository } from '../auth/user-repository';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Role } from '../platform/roles';
import type { AccountChangeRepository } from './account-change-repository';
import type { AccountChange, AccountPage, AdminAccount } from '../../contracts/account/account-admin-answers';
import type { AccountListQuery } from '../../contracts/account/account-admin-schemas';

const HISTORY_LIMIT = 100;

/** Roles, disabling and their history; each change and its history entry are written in one transaction. */
export class AccountAdminService {
  constructor(
    private readonly db: Knex,
    private readonly users: UserRepository,
    private readonly changes: AccountChangeRepository,
    private readonly signIn: SignInGuard,
  ) {}

  /** One page of accounts with their sign-in locks, so admins see who is locked out beside their roles. */
  async list(q: AccountListQuery): Promise<AccountPage> {
    const { items, total } = await this.users.page({
      ...q,
      disabled: q.state === undefined ? undefined : q.state === 'disabled',
    });
    const locks = await this.signIn.states(items.map((u) => u.email));
    return {
      items: items.map((u) => ({
        ...adminView(u),
        createdAt: u.created_at.toISOString(),
        signIn: locks.get(u.email) ?? { failures: 0, locked: false },
      })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    };
  }

  /** Lifts every sign-in lock on the account, once staff know its owner is the one signing in; 404 when none. */
  async clearSignInLock(id: number): Promise<void> {
    const row = await this.users.byId(id);
    if (!row) throw notFound('No such user.');
    await this.signIn.clear(row.email);
  }

  /**
   * Replaces an account's roles and records the change in its history; an admin cannot take admin away from
   * themselves, so the club is never locked out by a slip.
   */
  async setRoles(actorId: number, id: number, roles: readonly Role[]): Promise<AdminAccount> {
    const wanted = [...new Set(roles)];
    const next: Role[] = wanted.length ? wanted : ['fan'];
    if (id === actorId && !next.includes('admin'))
      throw badRequest('You cannot remove your own admin role.', { roles: 'Keep admin on your own account.' });
    return this.db.transaction(async (trx) => {
      const before = await this.mustLock(trx, id);
      const row = (await this.users.update(trx, id, { roles: next }))!;
      if (!sameRoles(before.roles, next))
        await this.changes.record(trx, {
          userId: id,
          changedBy: actorId,
          kind: 'roles',
          rolesBefore: before.roles,
          rolesAfter: next,
        });
      return adminView(row);
    });
  }

  /** Disables the account and ends its sessions; disabling a disabled account changes nothing. */
  async disable(actorId: number, id: number): Promise<AdminAccount> {
    if (id === actorId)
      throw badRequest('You cannot disable your own account: the club would be left without the admin doing it.', {
        account: 'Ask another admin.',
      });
    return this.setDisabled(actorId, id, true);
  }

  /** Lets a disabled account sign in again, recorded in its history like the disabling was. */
  async enable(actorId: number, id: number): Promise<AdminAccount> {
    return this.setDisabled(actorId, id, false);
  }

  /** The account's role and access changes, newest first, so admins can see who changed what and when. */
  async history(id: number): Promise<AccountChange[]> {
    if (!(await this.users.byId(id))) throw notFound('No such user.');
    return (await this.changes.history(id, HISTORY_LIMIT)).map((c) => ({
      id: c.id,
      kind: c.kind,
      added: c.roles_after.filter((r) => !c.roles_before.includes(r)),
      removed: c.roles_before.filter((r) => !c.roles_after.includes(r)),
      at: c.changed_at.toISOString(),
      by: c.changed_by === null ? null : { id: c.changed_by, name: c.changed_by_name ?? '' },
    }));
  }

  private setDisabled(actorId: number, id: number, disabled: boolean): Promise<AdminAccount> {
    return this.db.transaction(async (trx) => {
      const before = await this.mustLock(trx, id);
      if ((before.disabled_at !== null) === disabled) return adminView((await this.users.byId(id, trx))!);
      const row = (await this.users.update(trx, id, {
        disabled_at: disabled ? (trx.fn.now() as unknown as Date) : null,
      }))!;
      if (disabled) await this.changes.endSessions(trx, id);
      await this.changes.record(trx, {
        userId: id,
        changedBy: actorId,
        kind: disabled ? 'disabled' : 'enabled',
        rolesBefore: before.roles,
        rolesAfter: before.roles,
      });
      return adminView(row);
    });
  }

  private async mustLock(trx: Knex.Transaction, id: number) {
    const row = await this.changes.lockUser(trx, id);
    if (!row) throw notFound('No such user.');
    if (row.deleted_at)
      throw conflict(
        'account_deleted',
        'This account was deleted by its owner; it cannot be given roles, disabled or enabled.',
      );
    return row;
  }
}

const sameRoles = (a: readonly Role[], b: readonly Role[]) => a.length === b.length && a.every((r) => b.includes(r));

/** The admin's view of a user row. */
export function adminView(row: Parameters<typeof toSessionUser>[0]): AdminAccount {
  return {
    ...toSessionUser(row),
    disabledAt: row.disabled_at ? row.disabled_at.toISOString() : null,
    deletedAt: row.deleted_at ? row.deleted_at.toISOString() : null,
  };
}
