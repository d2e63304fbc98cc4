import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { clubTimeInWords } from '@contracts/dates/club-dates';
import type { SiteNamesView } from '@contracts/site/site-answers';

/** The team and club this Padside serves and the club's time zone, as `/api/site` returns them. */
export type { SiteNamesView };

// Until the answer arrives (or if it never does), dates follow this browser's own zone: asked when first needed,
// since the engine's first formatter is costly at start-up on a phone.
let browserZone: string | undefined;
const ownZone = () => (browserZone ??= new Intl.DateTimeFormat().resolvedOptions().timeZone);

/**
 * The team and club names, asked for when first needed; the deployment sets them, so they never change while the app
 * runs. A server-rendered page carries the answer in its transfer state, so the browser has them before it paints.
 */
@Injectable({ providedIn: 'root' })
export class SiteNames {
  private readonly names = signal<SiteNamesView>({ teamName: '', clubName: '', timeZone: '' });
  readonly teamName = computed(() => this.names().teamName);
  readonly clubName = computed(() => this.names().clubName);
  readonly timeZone = computed(() => this.names().timeZone || ownZone());
  /** Which clock the console's times follow, in words: "club time (Winnipeg)". */
  readonly clubTime = computed(() => clubTimeInWords(this.timeZone()));

  constructor() {
    inject(HttpClient)
      .get<SiteNamesView>('/api/site')
      .subscribe({ next: (names) => this.names.set(names), error: () => undefined });
  }
}
