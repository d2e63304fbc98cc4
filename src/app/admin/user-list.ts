import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { apiErrorMessage } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import type { Role } from '../core/user';
import { ClubDatePipe } from '../shared/club-date-pipe';
import { ConfirmDialog, type ConfirmData } from '../shared/confirm-dialog';
import { EmptyState } from '../shared/empty-state';
import { AccountHistoryDialog, type AccountHistoryData } from './account-history-dialog';
import { UserAdminApi } from './user-admin-api';
import type { AdminAccount } from '@contracts/account/account-admin-answers';
import { ROLE_LABELS } from '@contracts/labels/roles';

const EDITABLE_ROLES: Role[] = ['fan', 'member', 'sponsor', 'editor', 'treasurer', 'range_officer', 'admin'];
/** Roles that reach money or every account: granting one asks first. */
const WEIGHTY: Partial<Record<Role, string>> = {
  treasurer: 'Treasurers see the books, refund orders and record sponsor cash.',
  admin: 'Admins can do everything in the console, including granting roles and disabling accounts.',
};

/** Accounts with server-side paging, search and filters; roles toggled in place; disabling; history; sign-in locks. */
@Component({
  selector: 'ps-user-list',
  imports: [
    FormsModule,
    MatButtonModule,
    MatTableModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonToggleModule,
    ClubDatePipe,
    EmptyState,
  ],
  templateUrl: './user-list.html',
  styleUrl: './user-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly api = inject(UserAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly dialog = inject(MatDialog);
  protected readonly session = inject(SessionStore);

  protected readonly roles = EDITABLE_ROLES;
  protected readonly columns = ['displayName', 'email', 'roles', 'state', 'signIn'];
  protected readonly query = signal<{
    q: string;
    role?: Role;
    state?: 'active' | 'disabled';
    page: number;
    pageSize: number;
  }>({ q: '', page: 1, pageSize: 25 });
  protected readonly users = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });

  protected roleName(r: Role): string {
    return ROLE_LABELS[r];
  }

  protected search(q: string): void {
    this.query.update((v) => ({ ...v, q, page: 1 }));
  }

  protected filter(patch: { role?: Role | ''; state?: 'active' | 'disabled' | '' }): void {
    this.query.update((v) => ({
      ...v,
      ...('role' in patch ? { role: patch.role || undefined } : {}),
      ...('state' in patch ? { state: patch.state || undefined } : {}),
      page: 1,
    }));
  }

  protected changePage(e: PageEvent): void {
    this.query.update((v) => ({ ...v, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }

  /** Lifts the account's sign-in lock and address blocks, once staff know the owner is the one signing in. */
  protected async clearLock(user: AdminAccount): Promise<void> {
    try {
      await firstValueFrom(this.api.clearSignInLock(user.id));
      this.snackBar.open(`Sign-in lock cleared for ${user.displayName}.`, undefined, { duration: 3000 });
    } finally {
      this.users.reload();
    }
  }

  /** Saves the roles; granting treasurer or admin asks first, and going back leaves the roles as they were. */
  protected async saveRoles(user: AdminAccount, roles: Role[]): Promise<void> {
    const granted = roles.filter((r) => !user.roles.includes(r) && WEIGHTY[r]);
    if (granted.length) {
      const names = granted.map((r) => this.roleName(r).toLowerCase()).join(' and ');
      const ok = await this.confirm({
        title: `Make ${user.displayName} ${names}?`,
        message: granted.map((r) => WEIGHTY[r]).join(' '),
        confirm: `Grant ${names}`,
      });
      if (!ok) {
        this.users.reload();
        return;
      }
    }
    try {
      await firstValueFrom(this.api.setRoles(user.id, roles));
      this.snackBar.open(`Roles saved for ${user.displayName}.`, undefined, { duration: 3000 });
    } finally {
      this.users.reload();
    }
  }

  protected async setDisabled(user: AdminAccount, disabled: boolean): Promise<void> {
    if (disabled) {
      const ok = await this.confirm({
        title: `Disable ${user.displayName}?`,
        message:
          'They are signed out everywhere at once and cannot sign in until an admin enables the account again. Their orders, dues and posts stay as they are.',
        confirm: 'Disable account',
      });
      if (!ok) return;
    }
    try {
      await firstValueFrom(this.api.setDisabled(user.id, disabled));
      this.snackBar.open(
        disabled ? `${user.displayName} is disabled and signed out.` : `${user.displayName} can sign in again.`,
        undefined,
        { duration: 3000 },
      );
    } catch (err) {
      this.snackBar.open(apiErrorMessage(err), 'Close', { duration: 6000 });
    } finally {
      this.users.reload();
    }
  }

  protected showHistory(user: AdminAccount): void {
    this.dialog.open<AccountHistoryDialog, AccountHistoryData>(AccountHistoryDialog, {
      data: { id: user.id, displayName: user.displayName },
      width: 'min(640px, 96vw)',
    });
  }

  private confirm(data: ConfirmData): Promise<boolean | undefined> {
    return firstValueFrom(
      this.dialog
        .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, { data, width: 'min(480px, 96vw)' })
        .afterClosed(),
    );
  }
}
