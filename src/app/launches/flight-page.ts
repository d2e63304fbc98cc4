import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { SessionStore } from '../core/session-store';
import { FlightChart } from '../flights/flight-chart';
import { FlightLogUpload } from '../flights/flight-log-upload';
import { FlightCaution } from './flight-caution';
import { LaunchesApi } from './launches-api';
import { RECOVERY_LABELS } from '@contracts/labels/launch-statuses';
import { LabelPipe } from '../shared/label-pipe';

/** A flight's page: the card as filed, the range officer's decision and outcome, and the altimeter data. */
@Component({
  selector: 'ps-flight-page',
  imports: [RouterLink, DecimalPipe, LabelPipe, FlightCaution, FlightChart, FlightLogUpload],
  templateUrl: './flight-page.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightPage {
  protected readonly recoveryLabels = RECOVERY_LABELS;
  private readonly api = inject(LaunchesApi);
  private readonly session = inject(SessionStore);
  readonly id = input.required<string>();

  protected readonly page = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.flight(params),
  });
  protected readonly flight = computed(() => this.page.value()?.flight ?? null);
  /** The flyer and range staff may add the altimeter log once the flight has an outcome. */
  protected readonly canUpload = computed(() => {
    const f = this.flight();
    const me = this.session.user();
    return (
      !!f &&
      !!me &&
      f.status === 'flown' &&
      (f.flyer.userId === me.id || this.session.hasAnyRole(['range_officer', 'admin']))
    );
  });

  protected reload(): void {
    this.page.reload();
  }
}
