import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { apiErrorMessage } from '../core/api-error';
import { SessionStore } from '../core/session-store';
import { AccountApi } from './account-api';

/** Opened from the e-mailed link: confirms the address with the token in the URL. */
@Component({
  selector: 'ps-verify-email',
  imports: [RouterLink, MatButtonModule],
  template: `
    <section class="ps-narrow" aria-live="polite">
      <h1>Confirm e-mail</h1>
      @switch (state()) {
        @case ('working') {
          <p>Checking your link…</p>
        }
        @case ('done') {
          <p data-testid="verified">Thank you, your e-mail is confirmed.</p>
          @if (session.signedIn()) {
            <a mat-flat-button routerLink="/">Go to the storefront</a>
          } @else {
            <a mat-flat-button routerLink="/account/sign-in">Sign in</a>
          }
        }
        @case ('failed') {
          <p class="form-problem" role="alert">{{ problem() }}</p>
          <a mat-stroked-button routerLink="/account">Send a new link from your account page</a>
        }
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyEmail implements OnInit {
  private readonly api = inject(AccountApi);
  protected readonly session = inject(SessionStore);

  readonly token = input<string>('');
  protected readonly state = signal<'working' | 'done' | 'failed'>('working');
  protected readonly problem = signal('');

  async ngOnInit(): Promise<void> {
    try {
      await firstValueFrom(this.api.verifyEmail(this.token()));
      this.state.set('done');
      // The first read of the session may have answered before the confirmation: read it again once it has.
      await this.session.ready;
      if (this.session.signedIn()) await this.session.load();
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
      this.state.set('failed');
    }
  }
}
