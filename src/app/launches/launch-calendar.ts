import { ChangeDetectionStrategy, Component, DOCUMENT, computed, effect, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NgTemplateOutlet } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { EmptyState } from '../shared/empty-state';
import type { LaunchView } from '@contracts/launches/launch-answers';
import { LaunchesApi } from './launches-api';
import { PageMeta } from '../core/page-meta';
import { loadErrorStatus } from '../core/rendering/load-error-status';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** Today's date in a time zone, as YYYY-MM-DD. */
export function todayIn(timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(
    new Date(),
  );
}

function isOver(l: LaunchView, today: string): boolean {
  return l.date < today || l.status === 'done';
}

/** The club's launch calendar: coming launch days first, then the recent ones, and the feed to subscribe to. */
@Component({
  selector: 'ps-launch-calendar',
  imports: [RouterLink, NgTemplateOutlet, MatButtonModule, MatIconModule, EmptyState],
  templateUrl: './launch-calendar.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaunchCalendar {
  constructor() {
    inject(PageMeta).describe({
      title: 'Launch days',
      description: 'Coming and recent club launch days, with a calendar feed to subscribe to.',
      path: '/launches',
      type: 'website',
    });
    const answerLoadError = loadErrorStatus();
    effect(() => answerLoadError(this.launches.error()));
  }

  private readonly api = inject(LaunchesApi);
  protected readonly launches = rxResource({ stream: () => this.api.list() });
  /** The answer once loaded; value() itself throws while the resource holds an error. */
  private readonly loaded = computed(() => (this.launches.hasValue() ? this.launches.value() : undefined));
  protected readonly timeZone = computed(() => this.loaded()?.timeZone ?? '');
  private readonly today = computed(() => (this.timeZone() ? todayIn(this.timeZone()) : ''));
  /** A day closed after flying is over even on its own date: it goes with the recent ones, with its results. */
  protected readonly upcoming = computed(() => (this.loaded()?.items ?? []).filter((l) => !isOver(l, this.today())));
  protected readonly past = computed(() =>
    (this.loaded()?.items ?? []).filter((l) => isOver(l, this.today())).reverse(),
  );
  protected readonly feedUrl = `${inject(DOCUMENT).location.origin}/feeds/launches.ics`;
  protected readonly webcalUrl = this.feedUrl.replace(/^https?:/, 'webcal:');

  protected month(l: LaunchView): string {
    return MONTHS[Number(l.date.slice(5, 7)) - 1];
  }
  protected dayNumber(l: LaunchView): number {
    return Number(l.date.slice(8, 10));
  }
}
