import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { SessionStore } from '../session-store';
import type { User } from '../user';

/**
 * The signed-in user's menu in the top bar. Its own component so the shell can defer it: the menu's overlay code is
 * needed only once somebody is signed in, which the browser learns after the first paint.
 */
@Component({
  selector: 'ps-account-menu',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    <button
      mat-button
      type="button"
      [matMenuTriggerFor]="accountMenu"
      class="account"
      data-testid="account-menu"
      [attr.aria-label]="'Account menu, ' + user().displayName"
    >
      <mat-icon>account_circle</mat-icon>
      <span class="account-name">{{ user().displayName }}</span>
    </button>
    <mat-menu #accountMenu="matMenu">
      <a mat-menu-item routerLink="/account">Profile and password</a>
      <a mat-menu-item routerLink="/shop/orders">My orders</a>
      <a mat-menu-item routerLink="/membership/card">Member card</a>
      <a mat-menu-item routerLink="/account/flights">My flights</a>
      <button mat-menu-item type="button" (click)="signOut()">Sign out</button>
    </mat-menu>
  `,
  styles: `
    .account {
      color: #fff;
    }
    @media (max-width: 800px) {
      .account-name {
        display: none;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AccountMenu {
  readonly user = input.required<User>();
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigateByUrl('/');
  }
}
