import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';

/** The team and club this Padside serves, as `/api/site` returns them. */
export interface SiteNamesView {
  teamName: string;
  clubName: string;
}

/**
 * The team and club names, asked for when first needed; the deployment sets them, so they never change while the app
 * runs. A server-rendered page carries the answer in its transfer state, so the browser has them before it paints.
 */
@Injectable({ providedIn: 'root' })
export class SiteNames {
  private readonly names = signal<SiteNamesView>({ teamName: '', clubName: '' });
  readonly teamName = computed(() => this.names().teamName);
  readonly clubName = computed(() => this.names().clubName);

  constructor() {
    inject(HttpClient)
      .get<SiteNamesView>('/api/site')
      .subscribe({ next: (names) => this.names.set(names), error: () => undefined });
  }
}
