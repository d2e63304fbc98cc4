import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatTableModule } from '@angular/material/table';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { ChartConfiguration } from 'chart.js';
import { labelOf } from '@contracts/labels/label-of';
import { MOVEMENT_SOURCE_LABELS as SOURCE_LABELS } from '@contracts/labels/money-movements';
import { SiteNames } from '../../core/site-names';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { MoneyPipe } from '../../shared/money-pipe';
import type { RevenueRow } from '@contracts/books/books-answers';
import type { DateRange } from '@contracts/books/books-schemas';
import { BooksApi } from './books-api';
import { FeeSettingsCard } from './fee-settings-card';
import { currentQuarter } from './period';
import { formatMonth } from '@contracts/dates/club-dates';

const SOURCE_COLOURS: Record<RevenueRow['source'], string> = { merch: '#376286', dues: '#c8561f', sponsor: '#6a7988' };

/** Tax collected per authority, income net of tax and fees by month, and the ledger export for one period. */
@Component({
  selector: 'ps-books-page',
  imports: [
    FormsModule,
    MatButtonModule,
    MatCardModule,
    MatFormFieldModule,
    MatInputModule,
    MatTableModule,
    BaseChartDirective,
    MoneyPipe,
    ClubDatePipe,
    EmptyState,
    FeeSettingsCard,
  ],
  providers: [provideCharts(withDefaultRegisterables())],
  templateUrl: './books-page.html',
  styleUrl: './books-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BooksPage {
  private readonly api = inject(BooksApi);
  /** The report's days are club days: "club time (Winnipeg)". */
  protected readonly site = inject(SiteNames);

  protected readonly period = signal<DateRange>(currentQuarter());
  protected readonly tax = rxResource({ params: () => this.period(), stream: ({ params }) => this.api.tax(params) });
  protected readonly revenue = rxResource({
    params: () => this.period(),
    stream: ({ params }) => this.api.revenue(params),
  });
  protected readonly sponsorValue = rxResource({ stream: () => this.api.sponsorValue() });
  protected readonly sponsorColumns = ['sponsor', 'tier', 'cash', 'inKind', 'total', 'credits'];
  protected readonly taxColumns = ['tax', 'taxable', 'charged', 'refunded', 'net'];
  protected readonly revenueColumns = ['month', 'source', 'gross', 'tax', 'income', 'refunds', 'fees', 'net'];

  protected readonly taxCsv = computed(() => this.api.csvUrl('tax.csv', this.period()));
  protected readonly ledgerCsv = computed(() => this.api.csvUrl('ledger.csv', this.period()));

  protected readonly chart = computed<ChartConfiguration<'bar'>['data']>(() => {
    const rows = this.revenue.value()?.rows ?? [];
    const months = [...new Set(rows.map((r) => r.month))];
    return {
      labels: months.map(formatMonth),
      datasets: (Object.keys(SOURCE_LABELS) as RevenueRow['source'][]).map((source) => ({
        label: SOURCE_LABELS[source],
        backgroundColor: SOURCE_COLOURS[source],
        data: months.map((m) => (rows.find((r) => r.month === m && r.source === source)?.netCents ?? 0) / 100),
      })),
    };
  });
  protected readonly chartOptions: ChartConfiguration<'bar'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    scales: { x: { stacked: true }, y: { stacked: true, title: { display: true, text: 'Net C$' } } },
  };

  protected setPeriod(from: string, to: string): void {
    if (from && to) this.period.set({ from, to });
  }

  protected sourceLabel(source: string): string {
    return labelOf(SOURCE_LABELS, source);
  }

  protected print(): void {
    window.print();
  }
}
