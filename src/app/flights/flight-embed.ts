import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FlightChart } from './flight-chart';
import { FlightDataApi } from './flight-data-api';

/** A flight's chart and summary inside a build log (the `%flight <id>` marker); a short note when there is no data. */
@Component({
  selector: 'ps-flight-embed',
  imports: [DecimalPipe, FlightChart],
  templateUrl: './flight-embed.html',
  styleUrl: './flight-embed.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightEmbed {
  private readonly api = inject(FlightDataApi);

  readonly flightId = input.required<number>();

  protected readonly flight = rxResource({
    params: () => this.flightId(),
    stream: ({ params }) => this.api.get(params),
  });
  /** The analysed log, or null while loading, on an error (404 included) or when no log is in yet. */
  protected readonly data = computed(() => {
    if (this.flight.error()) return null;
    const f = this.flight.value();
    const d = f?.data;
    return f && d?.series.length
      ? { name: f.flight.rocketName, summary: d.summary, series: d.series, events: d.events }
      : null;
  });
  protected readonly unavailable = computed(
    () => this.flight.error() !== undefined || (this.flight.hasValue() && this.data() === null),
  );
}
