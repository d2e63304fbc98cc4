import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

/** The team and club this Padside serves, as `/api/site` returns them. */
export interface SiteNamesView {
  teamName: string;
  clubName: string;
}

/** The team and club names, read once at start-up; the deployment sets them, so they never change while the app runs. */
@Injectable({ providedIn: 'root' })
export class SiteNames {
  private readonly http = inject(HttpClient);
  private readonly names = signal<SiteNamesView>({ teamName: '', clubName: '' });
  readonly teamName = computed(() => this.names().teamName);
  readonly clubName = computed(() => this.names().clubName);

  async load(): Promise<void> {
    this.names.set(await firstValueFrom(this.http.get<SiteNamesView>('/api/site')));
  }
}
