import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { apiErrorMessage } from '../core/api-error';
import { AnnouncementsApi } from './announcements-api';

/**
 * Opened from a mail's footer link, no sign-in needed: names the list and the address, and stops the list with one
 * click. Opening the page changes nothing, so a mail scanner that follows links unsubscribes nobody.
 */
@Component({
  selector: 'ps-unsubscribe-page',
  imports: [RouterLink, MatButtonModule],
  template: `
    <section class="ps-narrow" aria-live="polite">
      <h1>Stop e-mails</h1>
      @if (done(); as d) {
        <p role="status" data-testid="unsubscribed">
          Done: {{ d.email }} gets no more e-mails about {{ d.label }}. Receipts and other messages you need still
          arrive.
        </p>
        <a mat-stroked-button routerLink="/">Back to the home page</a>
      } @else if (about.error()) {
        <p class="form-problem" role="alert">{{ message(about.error()) }}</p>
      } @else if (about.value(); as a) {
        <p>
          Stop e-mails about <strong>{{ a.label }}</strong> to <strong>{{ a.email }}</strong>?
        </p>
        @if (problem(); as p) {
          <p class="form-problem" role="alert">{{ p }}</p>
        }
        <button mat-flat-button type="button" (click)="stop()" [disabled]="busy()">Stop these e-mails</button>
      } @else {
        <p>Checking your link…</p>
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnsubscribePage {
  private readonly api = inject(AnnouncementsApi);
  readonly token = input<string>('');
  protected readonly about = rxResource({
    params: () => this.token(),
    stream: ({ params }) => this.api.describeUnsubscribe(params),
  });
  protected readonly done = signal<{ email: string; label: string } | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected message(err: unknown): string {
    return apiErrorMessage(err);
  }

  protected async stop(): Promise<void> {
    this.busy.set(true);
    try {
      this.done.set((await firstValueFrom(this.api.unsubscribe(this.token()))).unsubscribed);
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    } finally {
      this.busy.set(false);
    }
  }
}
