import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import type { Role } from '../core/user';
import { UserAdminApi } from './user-admin-api';

/** Whose history to show. */
export interface AccountHistoryData {
  id: number;
  displayName: string;
}

const roleName = (r: Role) => (r === 'range_officer' ? 'range officer' : r);

/** Who changed an account's roles or disabled it, and when, newest first. */
@Component({
  selector: 'ps-account-history-dialog',
  imports: [MatDialogModule, MatButtonModule, DatePipe],
  template: `
    <h2 mat-dialog-title>History of {{ data.displayName }}</h2>
    <mat-dialog-content>
      @if (history.value(); as items) {
        @if (items.length) {
          <table>
            <caption class="ps-visually-hidden">
              Changes to this account, newest first
            </caption>
            <thead>
              <tr>
                <th scope="col">When</th>
                <th scope="col">Who</th>
                <th scope="col">What</th>
              </tr>
            </thead>
            <tbody>
              @for (c of items; track c.id) {
                <tr>
                  <td>
                    <time [attr.datetime]="c.at">{{ c.at | date: 'medium' }}</time>
                  </td>
                  <td>{{ c.by?.name ?? 'Padside (automatic)' }}</td>
                  <td>{{ describe(c) }}</td>
                </tr>
              }
            </tbody>
          </table>
        } @else {
          <p>No role change or disabling recorded yet.</p>
        }
      } @else if (history.error()) {
        <p class="form-problem" role="alert">The history could not be loaded.</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end"
      ><button mat-button type="button" mat-dialog-close cdkFocusInitial>Close</button></mat-dialog-actions
    >
  `,
  styles: `
    table {
      width: 100%;
      border-collapse: collapse;
    }
    th,
    td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountHistoryDialog {
  private readonly api = inject(UserAdminApi);
  protected readonly data = inject<AccountHistoryData>(MAT_DIALOG_DATA);
  protected readonly history = rxResource({ stream: () => this.api.history(this.data.id) });

  protected describe(c: { kind: 'roles' | 'disabled' | 'enabled'; added: Role[]; removed: Role[] }): string {
    if (c.kind === 'disabled') return 'Disabled the account';
    if (c.kind === 'enabled') return 'Enabled the account again';
    return [
      c.added.length ? `Granted ${c.added.map(roleName).join(', ')}` : '',
      c.removed.length ? `Removed ${c.removed.map(roleName).join(', ')}` : '',
    ]
      .filter(Boolean)
      .join('; ');
  }
}
