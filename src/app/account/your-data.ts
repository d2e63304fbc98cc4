import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { SessionStore } from '../core/session-store';
import { DeleteAccountDialog } from './delete-account-dialog';

/** The account page's card for the person's own data: the download, the privacy page, and deleting the account. */
@Component({
  selector: 'ps-your-data',
  imports: [RouterLink, MatButtonModule, MatCardModule, MatIconModule],
  templateUrl: './your-data.html',
  styles: `
    mat-card {
      padding: 8px;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .danger {
      --mat-button-text-label-text-color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class YourData {
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  /** A plain link: the browser saves the ZIP the server streams, with the session's cookie. */
  protected readonly exportUrl = '/api/account/export';

  protected async askToDelete(): Promise<void> {
    const deleted = await firstValueFrom(
      this.dialog
        .open<DeleteAccountDialog, void, boolean>(DeleteAccountDialog, {
          width: '560px',
          maxWidth: '95vw',
          autoFocus: 'first-tabbable',
        })
        .afterClosed(),
    );
    if (!deleted) return;
    this.session.forgetDeleted();
    await this.router.navigateByUrl('/');
    this.snackBar.open(
      'Your account was deleted. A last e-mail confirms what was erased and what was kept.',
      undefined,
      { duration: 8000 },
    );
  }
}
