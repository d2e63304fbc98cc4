import { ChangeDetectionStrategy, Component, OnInit, inject, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { apiErrorMessage } from '../core/api-error';
import { AnnouncementsApi } from './announcements-api';

const LABELS: Record<string, string> = {
  drops: 'new runs and drops',
  launches: 'launch days',
  'build-logs': 'new build logs',
};

/** Opened from the confirmation mail: confirms the lists with the single-use token in the URL. */
@Component({
  selector: 'ps-subscription-confirm',
  imports: [RouterLink, MatButtonModule],
  template: `
    <section class="ps-narrow" aria-live="polite">
      <h1>Confirm your e-mails</h1>
      @switch (state()) {
        @case ('working') {
          <p>Checking your link…</p>
        }
        @case ('done') {
          <p data-testid="subscription-confirmed">
            Confirmed: {{ email() }} will hear about {{ lists() }}. Every message has a link to stop it.
          </p>
          <a mat-flat-button routerLink="/">Back to the home page</a>
        }
        @case ('failed') {
          <p class="form-problem" role="alert">{{ problem() }}</p>
          <a mat-stroked-button routerLink="/">Sign up again from the home page</a>
        }
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SubscriptionConfirm implements OnInit {
  private readonly api = inject(AnnouncementsApi);
  readonly token = input<string>('');
  protected readonly state = signal<'working' | 'done' | 'failed'>('working');
  protected readonly problem = signal('');
  protected readonly email = signal('');
  protected readonly lists = signal('');

  async ngOnInit(): Promise<void> {
    try {
      const { confirmed } = await firstValueFrom(this.api.confirm(this.token()));
      this.email.set(confirmed.email);
      this.lists.set(confirmed.topics.map((t) => LABELS[t] ?? t).join(', '));
      this.state.set('done');
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
      this.state.set('failed');
    }
  }
}
