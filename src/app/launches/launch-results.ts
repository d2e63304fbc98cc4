import { DecimalPipe, KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { EmptyState } from '../shared/empty-state';
import { FlightCaution } from './flight-caution';
import { LaunchesApi, OUTCOMES } from './launches-api';

/** A launch day's results: the flights, the highest one and how they ended. */
@Component({
  selector: 'ps-launch-results',
  imports: [RouterLink, DecimalPipe, KeyValuePipe, EmptyState, FlightCaution],
  templateUrl: './launch-results.html',
  styleUrl: './launches.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaunchResults {
  private readonly api = inject(LaunchesApi);
  readonly id = input.required<string>();
  protected readonly results = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.results(params),
  });
  protected readonly outcomeLabel = (code: string) => OUTCOMES.find((o) => o.value === code)?.label ?? code;
}
