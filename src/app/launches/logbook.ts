import { DecimalPipe, KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { EmptyState } from '../shared/empty-state';
import { FlightCaution } from './flight-caution';
import { LaunchesApi } from './launches-api';

/** The member's logbook: every card by date, motors by class, total impulse flown and the best altitude. */
@Component({
  selector: 'ps-logbook',
  imports: [RouterLink, DecimalPipe, KeyValuePipe, EmptyState, FlightCaution],
  templateUrl: './logbook.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Logbook {
  private readonly api = inject(LaunchesApi);
  protected readonly book = rxResource({ stream: () => this.api.logbook() });
}
