import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { apiErrorMessage } from '../core/api-error';
import type { MySubscription } from '@contracts/announcements/subscription-answers';
import { AnnouncementsApi } from './announcements-api';
import { SignUpForm } from './sign-up-form';

/** The account page's e-mail lists: what the account address gets, a stop button for each, and the sign-up form. */
@Component({
  selector: 'ps-my-subscriptions',
  imports: [MatButtonModule, SignUpForm],
  template: `
    <h2>E-mail lists</h2>
    @if (problem(); as p) {
      <p class="form-problem" role="alert">{{ p }}</p>
    }
    @if (mine.value()?.items; as items) {
      @if (items.length === 0) {
        <p>You are on no list yet.</p>
      } @else {
        <ul class="lists">
          @for (s of items; track s.unsubscribeToken + s.productId) {
            <li>
              <span
                >{{ s.productName ? 'The next run of ' + s.productName : s.label }} ·
                {{ s.status === 'confirmed' ? 'since ' + s.since.slice(0, 10) : 'waiting for your confirmation' }}</span
              >
              <button mat-button type="button" (click)="stop(s)" [attr.aria-label]="'Stop e-mails about ' + s.label">
                Stop
              </button>
            </li>
          }
        </ul>
      }
    }
    <ps-sign-up-form page="account" [email]="email()" heading="Add a list" />
  `,
  styles: `
    .lists {
      list-style: none;
      padding: 0;
    }
    .lists li {
      display: flex;
      justify-content: space-between;
      align-items: center;
      gap: 8px;
      flex-wrap: wrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MySubscriptions {
  private readonly api = inject(AnnouncementsApi);
  readonly email = input.required<string>();
  protected readonly mine = rxResource({ stream: () => this.api.mine() });
  protected readonly problem = signal<string | null>(null);

  protected async stop(s: MySubscription): Promise<void> {
    try {
      await firstValueFrom(this.api.unsubscribe(s.unsubscribeToken));
      this.mine.reload();
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    }
  }
}
