import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import type { Role, User } from '../core/user';
import { EmptyState } from '../shared/empty-state';
import { UserAdminApi } from './user-admin-api';

const EDITABLE_ROLES: Role[] = ['fan', 'member', 'sponsor', 'editor', 'treasurer', 'range_officer', 'admin'];

/** Accounts with server-side paging and search; roles toggled in place; sign-in locks cleared. */
@Component({
  selector: 'ps-user-list',
  imports: [DatePipe, FormsModule, MatButtonModule, MatTableModule, MatPaginatorModule, MatFormFieldModule, MatInputModule, MatButtonToggleModule, EmptyState],
  templateUrl: './user-list.html',
  styles: `.ps-page { max-width: none; } table { width: 100%; } mat-button-toggle-group { flex-wrap: wrap; } .lock { color: var(--mat-sys-error); font-weight: 600; margin-right: 8px; } .deleted { font-style: italic; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly api = inject(UserAdminApi);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly roles = EDITABLE_ROLES;
  protected readonly columns = ['displayName', 'email', 'roles', 'signIn'];
  protected readonly query = signal({ q: '', page: 1, pageSize: 25 });
  protected readonly users = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });

  protected search(q: string): void {
    this.query.update((v) => ({ ...v, q, page: 1 }));
  }

  protected changePage(e: PageEvent): void {
    this.query.update((v) => ({ ...v, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }

  /** Lifts the account's sign-in lock and address blocks, once staff know the owner is the one signing in. */
  protected async clearLock(user: User): Promise<void> {
    try {
      await firstValueFrom(this.api.clearSignInLock(user.id));
      this.snackBar.open(`Sign-in lock cleared for ${user.displayName}.`, undefined, { duration: 3000 });
    } finally {
      this.users.reload();
    }
  }

  protected async saveRoles(user: User, roles: Role[]): Promise<void> {
    try {
      await firstValueFrom(this.api.setRoles(user.id, roles));
      this.snackBar.open(`Roles saved for ${user.displayName}.`, undefined, { duration: 3000 });
    } finally {
      this.users.reload();
    }
  }
}
