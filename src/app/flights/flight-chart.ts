import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { ChartConfiguration, TooltipItem } from 'chart.js';
import { EVENT_LABELS, type FlightEvent, type FlightSeriesPoint } from './flight-data';

const ALTITUDE_COLOUR = '#376286';
const SPEED_COLOUR = '#c8561f';
const EVENT_COLOUR = '#1d2733';

/** Altitude and speed at a time, read off the series between its two nearest points. */
export function pointAt(series: FlightSeriesPoint[], t: number): { altitudeM: number; speedMps: number } | null {
  if (series.length === 0) return null;
  let hi = series.findIndex((p) => p.t >= t);
  if (hi === -1) hi = series.length - 1;
  const lo = Math.max(0, hi - 1);
  const a = series[lo];
  const b = series[hi];
  const f = b.t === a.t ? 0 : Math.min(1, Math.max(0, (t - a.t) / (b.t - a.t)));
  return {
    altitudeM: a.altitudeM + f * (b.altitudeM - a.altitudeM),
    speedMps: a.speedMps + f * (b.speedMps - a.speedMps),
  };
}

/** Altitude and vertical speed against time with the flight's events marked, and the same in a table. */
@Component({
  selector: 'ps-flight-chart',
  imports: [BaseChartDirective, DecimalPipe],
  providers: [provideCharts(withDefaultRegisterables())],
  templateUrl: './flight-chart.html',
  styleUrl: './flight-chart.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlightChart {
  readonly series = input.required<FlightSeriesPoint[]>();
  readonly events = input<FlightEvent[]>([]);

  /** Each event with its name and where the flight was at that moment. */
  protected readonly eventRows = computed(() =>
    this.events().map((e) => ({
      kind: e.kind,
      label: EVENT_LABELS[e.kind] ?? e.kind,
      t: e.t,
      ...(pointAt(this.series(), e.t) ?? { altitudeM: 0, speedMps: 0 }),
    })),
  );

  /** The chart in words, for screen readers (the table below has the numbers). */
  protected readonly description = computed(() => {
    const s = this.series();
    if (s.length === 0) return 'No flight data to chart.';
    const top = s.reduce((best, p) => (p.altitudeM > best.altitudeM ? p : best), s[0]);
    const fastest = s.reduce((best, p) => (p.speedMps > best.speedMps ? p : best), s[0]);
    return (
      `Chart of altitude in metres and vertical speed in metres per second against seconds from liftoff. ` +
      `Highest point ${Math.round(top.altitudeM)} m at ${top.t.toFixed(1)} s; fastest climb ${Math.round(fastest.speedMps)} m/s at ${fastest.t.toFixed(1)} s. ` +
      `The table of events below gives the numbers.`
    );
  });

  protected readonly chartData = computed<ChartConfiguration<'line'>['data']>(() => {
    const s = this.series();
    return {
      datasets: [
        {
          label: 'Altitude (m)',
          data: s.map((p) => ({ x: p.t, y: p.altitudeM })),
          borderColor: ALTITUDE_COLOUR,
          backgroundColor: ALTITUDE_COLOUR,
          yAxisID: 'y',
          pointRadius: 0,
          borderWidth: 2,
        },
        {
          label: 'Vertical speed (m/s)',
          data: s.map((p) => ({ x: p.t, y: p.speedMps })),
          borderColor: SPEED_COLOUR,
          backgroundColor: SPEED_COLOUR,
          yAxisID: 'speed',
          pointRadius: 0,
          borderWidth: 1.5,
          borderDash: [6, 3],
        },
        {
          label: 'Events',
          data: this.eventRows().map((e) => ({ x: e.t, y: e.altitudeM })),
          yAxisID: 'y',
          showLine: false,
          pointRadius: 6,
          pointHoverRadius: 8,
          pointStyle: 'rectRot',
          borderColor: EVENT_COLOUR,
          backgroundColor: '#ffffff',
          borderWidth: 2,
        },
      ],
    };
  });

  protected readonly options = computed<ChartConfiguration<'line'>['options']>(() => {
    const rows = this.eventRows();
    return {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      interaction: { mode: 'nearest', intersect: false },
      scales: {
        x: { type: 'linear', title: { display: true, text: 'Seconds from liftoff' } },
        y: { type: 'linear', position: 'left', title: { display: true, text: 'Altitude above the pad (m)' } },
        speed: {
          type: 'linear',
          position: 'right',
          title: { display: true, text: 'Vertical speed (m/s)' },
          grid: { drawOnChartArea: false },
        },
      },
      plugins: {
        tooltip: {
          callbacks: {
            label: (item: TooltipItem<'line'>) =>
              item.datasetIndex === 2
                ? `${rows[item.dataIndex]?.label ?? 'Event'} at ${Number(item.parsed.x).toFixed(2)} s`
                : `${item.dataset.label}: ${Number(item.parsed.y).toFixed(1)}`,
          },
        },
      },
    };
  });
}
