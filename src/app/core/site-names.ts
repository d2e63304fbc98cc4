import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { clubTimeInWords } from '@contracts/dates/club-dates';

/** The team and club this Padside serves and the club's time zone, as `/api/site` returns them. */
export interface SiteNamesView {
  teamName: string;
  clubName: string;
  /** A tz database name such as `America/Winnipeg`: every date and time is shown in club time. */
  timeZone: string;
}

// Until the answer arrives (or if it never does), dates follow this browser's own zone.
const BROWSER_ZONE = new Intl.DateTimeFormat().resolvedOptions().timeZone;

/** The team and club names, read once at start-up; the deployment sets them, so they never change while the app runs. */
@Injectable({ providedIn: 'root' })
export class SiteNames {
  private readonly http = inject(HttpClient);
  private readonly names = signal<SiteNamesView>({ teamName: '', clubName: '', timeZone: BROWSER_ZONE });
  readonly teamName = computed(() => this.names().teamName);
  readonly clubName = computed(() => this.names().clubName);
  readonly timeZone = computed(() => this.names().timeZone || BROWSER_ZONE);
  /** Which clock the console's times follow, in words: "club time (Winnipeg)". */
  readonly clubTime = computed(() => clubTimeInWords(this.timeZone()));

  async load(): Promise<void> {
    this.names.set(await firstValueFrom(this.http.get<SiteNamesView>('/api/site')));
  }
}
