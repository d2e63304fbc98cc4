import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DecimalPipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { ChartConfiguration } from 'chart.js';
import { SessionStore } from '../../core/session-store';
import { SiteNames } from '../../core/site-names';
import { DELIVERABLE_KIND_LABELS } from '@contracts/labels/deliverable-kinds';
import { labelOf } from '@contracts/labels/label-of';
import { MEMBERSHIP_STATUS_LABELS } from '@contracts/labels/membership-statuses';
import { MOVEMENT_SOURCE_LABELS } from '@contracts/labels/money-movements';
import { RUN_STATE_LABELS } from '@contracts/labels/run-states';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { LabelPipe } from '../../shared/label-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { BooksApi } from '../books/books-api';
import { EditorOverview } from './editor-overview';
import { formatMonth } from '@contracts/dates/club-dates';

const SOURCES = [
  { key: 'merch', label: MOVEMENT_SOURCE_LABELS.merch, colour: '#376286' },
  { key: 'dues', label: MOVEMENT_SOURCE_LABELS.dues, colour: '#c8561f' },
  { key: 'sponsor', label: MOVEMENT_SOURCE_LABELS.sponsor, colour: '#6a7988' },
];
const STATUS_COLOURS: Record<string, string> = {
  active: '#376286',
  lapsing: '#e8703a',
  lapsed: '#9eadbd',
  pending: '#c5c6cb',
};

/** The console's overview: today's numbers as cards, each linking to the table behind it, and three charts. */
@Component({
  selector: 'ps-dashboard',
  imports: [
    RouterLink,
    DecimalPipe,
    EditorOverview,
    MatCardModule,
    MatFormFieldModule,
    MatSelectModule,
    BaseChartDirective,
    MoneyPipe,
    ClubDatePipe,
    LabelPipe,
  ],
  providers: [provideCharts(withDefaultRegisterables())],
  templateUrl: './dashboard.html',
  styleUrl: './dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Dashboard {
  private readonly api = inject(BooksApi);
  protected readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);
  protected readonly kindLabels = DELIVERABLE_KIND_LABELS;
  protected readonly runStateLabels = RUN_STATE_LABELS;
  protected readonly canSeeBooks = computed(() => this.session.hasAnyRole(['treasurer', 'admin']));
  /** Editors see their drafts, scheduled posts and the sponsor credits owed. */
  protected readonly isEditor = computed(() => this.session.hasAnyRole(['editor']));
  protected readonly data = rxResource({
    params: () => this.canSeeBooks() || undefined,
    stream: () => this.api.dashboard(),
  });

  protected readonly runs = rxResource({
    params: () => this.canSeeBooks() || undefined,
    stream: () => this.api.runs(),
  });
  /** The run whose sizes are charted: the newest until the user picks another. */
  protected readonly runId = linkedSignal<number | null>(() => this.runs.value()?.items[0]?.id ?? null);
  protected readonly units = rxResource({
    params: () => this.runId() ?? undefined,
    stream: ({ params }) => this.api.unitsBySize(params),
  });
  protected readonly unitsChart = computed<ChartConfiguration<'bar'>['data']>(() => {
    const items = this.units.value()?.items ?? [];
    return {
      labels: items.map((i) => i.label),
      datasets: [{ label: 'Paid units', backgroundColor: '#376286', data: items.map((i) => i.units) }],
    };
  });
  protected readonly unitsSummary = computed(() =>
    (this.units.value()?.items ?? []).map((i) => `${i.label} ${i.units}`).join(', '),
  );
  protected readonly revenueChart = computed<ChartConfiguration<'bar'>['data']>(() => {
    const rows = this.data.value()?.revenueByMonth ?? [];
    const months = [...new Set(rows.map((r) => r.month))];
    return {
      labels: months.map(formatMonth),
      datasets: SOURCES.map((s) => ({
        label: s.label,
        backgroundColor: s.colour,
        data: months.map((m) => (rows.find((r) => r.month === m && r.source === s.key)?.netCents ?? 0) / 100),
      })),
    };
  });
  protected readonly statusChart = computed<ChartConfiguration<'doughnut'>['data'] | null>(() => {
    const byStatus = this.data.value()?.membersByStatus;
    if (!byStatus) return null;
    const codes = Object.keys(byStatus);
    return {
      labels: codes.map((c) => labelOf(MEMBERSHIP_STATUS_LABELS, c)),
      datasets: [
        { data: codes.map((c) => byStatus[c]), backgroundColor: codes.map((c) => STATUS_COLOURS[c] ?? '#8f9196') },
      ],
    };
  });
  protected readonly statusSummary = computed(() =>
    Object.entries(this.data.value()?.membersByStatus ?? {})
      .map(([s, n]) => `${labelOf(MEMBERSHIP_STATUS_LABELS, s)} ${n}`)
      .join(', '),
  );
  protected readonly barOptions: ChartConfiguration<'bar'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    scales: { x: { stacked: true }, y: { stacked: true } },
  };
  protected readonly doughnutOptions: ChartConfiguration<'doughnut'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
  };
}
