import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { apiErrorMessage } from '../core/api-error';
import { PageMeta, SHARE_IMAGE } from '../core/page-meta';
import { isNotFound, loadErrorStatus } from '../core/rendering/load-error-status';
import { SessionStore } from '../core/session-store';
import { SiteNames } from '../core/site-names';
import { launchData } from '../core/structured-data';
import { FlightCaution } from './flight-caution';
import { LaunchesApi } from './launches-api';
import { ClubDatePipe } from '../shared/club-date-pipe';

/** One launch day: when and where, the reply (coming or not), and the flight card once checked in at the field. */
@Component({
  selector: 'ps-launch-page',
  imports: [RouterLink, ClubDatePipe, MatButtonModule, MatButtonToggleModule, FlightCaution],
  templateUrl: './launch-page.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaunchPage {
  protected readonly site = inject(SiteNames);
  private readonly api = inject(LaunchesApi);
  protected readonly session = inject(SessionStore);
  readonly id = input.required<string>();

  protected readonly page = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.show(params, this.session.signedIn()),
  });
  protected readonly launch = computed(() => (this.page.hasValue() ? this.page.value().launch : null));
  /** The API said there is no such launch day; any other failure is worth a retry. */
  protected readonly missing = computed(() => isNotFound(this.page.error()));
  protected readonly going = signal<boolean | null | undefined>(undefined);
  /** The reply shown: the one just sent, else the stored one. */
  protected readonly reply = computed(() =>
    this.going() !== undefined ? this.going() : (this.page.value()?.me?.going ?? null),
  );
  protected readonly problem = signal<string | null>(null);
  protected readonly mapUrl = computed(() => {
    const s = this.launch()?.site;
    return s?.lat != null && s?.lon != null
      ? `https://www.openstreetmap.org/?mlat=${s.lat}&mlon=${s.lon}#map=14/${s.lat}/${s.lon}`
      : null;
  });

  constructor() {
    const meta = inject(PageMeta);
    const site = inject(SiteNames);
    const answerLoadError = loadErrorStatus();
    effect(() => {
      answerLoadError(this.page.error());
      const p = this.page.hasValue() ? this.page.value() : undefined;
      if (!p) return;
      const l = p.launch;
      const path = `/launches/${l.id}`;
      meta.describe({
        title: `${l.title}, ${l.date}`,
        description:
          `${l.statusLabel}: ${l.date}, ${l.startsAt} to ${l.endsAt} at ${l.site.name}.${l.notes ? ' ' + l.notes : ''}`.slice(
            0,
            300,
          ),
        path,
        type: 'website',
        data: launchData(
          l,
          p.timeZone,
          meta.absolute(path),
          meta.absolute(SHARE_IMAGE.url),
          site.clubName() || 'Padside',
        ),
      });
    });
    // The page may have come from the server render, made as a visitor: once the session says who this is, their own
    // reply is fetched.
    effect(() => {
      if (this.session.signedIn() && untracked(() => this.page.hasValue() && this.page.value().me === null))
        this.page.reload();
    });
  }

  protected async answer(going: boolean): Promise<void> {
    this.problem.set(null);
    try {
      const res = await firstValueFrom(this.api.rsvp(Number(this.id()), going));
      this.going.set(res.going);
      this.page.value.update((p) => (p ? { ...p, launch: res.launch } : p));
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    }
  }
}
