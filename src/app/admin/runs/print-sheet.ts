import { ChangeDetectionStrategy, Component, inject, input, numberAttribute } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { ShopAdminApi } from '../orders/shop-admin-api';

/** The print-run sheet for the printer: per size, paid units, spares and pieces to print; printable and as CSV. */
@Component({
  selector: 'ps-print-sheet',
  imports: [ClubDatePipe, RouterLink, MatButtonModule, MoneyPipe],
  template: `
    <section class="ps-page">
      <p class="ps-no-print"><a routerLink="/console/runs">← All runs</a></p>
      @if (sheet.value(); as s) {
        <h1>Print-run sheet: {{ s.run.name }}</h1>
        <p class="kind" [class.final]="s.kind === 'final'">
          {{ s.kind === 'final' ? 'Final: the window has closed.' : 'Preview: orders can still arrive until ' }}
          @if (s.kind === 'preview') {
            {{ s.run.closesAt | clubDate: 'dateTime' }}.
          }
        </p>
        <p>
          Rules: {{ s.rules.sparesPercent }}% spares (rounded up), packs of {{ s.rules.packMultiple }}, at least
          {{ s.rules.minimumPerDesign }} pieces for the design.
        </p>
        <table>
          <caption class="ps-visually-hidden">
            Pieces to print per variant
          </caption>
          <thead>
            <tr>
              <th scope="col">SKU</th>
              <th scope="col">Variant</th>
              <th scope="col">Paid</th>
              <th scope="col">Spares</th>
              <th scope="col">To print</th>
            </tr>
          </thead>
          <tbody>
            @for (l of s.lines; track l.variantId) {
              <tr>
                <td>{{ l.sku }}</td>
                <td>{{ l.label }}</td>
                <td>{{ l.paid }}</td>
                <td>{{ l.spares }}</td>
                <td>
                  <strong>{{ l.toPrint }}</strong>
                </td>
              </tr>
            }
          </tbody>
          <tfoot>
            <tr>
              <th scope="row" colspan="2">Total</th>
              <td>{{ s.totalPaid }}</td>
              <td></td>
              <td>
                <strong>{{ s.totalToPrint }}</strong>
              </td>
            </tr>
          </tfoot>
        </table>
        @if (s.estimatedCostCents !== null) {
          <p>
            Estimated printing cost: {{ s.estimatedCostCents | money }} ({{ s.totalToPrint }} ×
            {{ s.unitCostCents | money }}).
          </p>
        }
        <p class="ps-no-print">
          <button mat-flat-button type="button" (click)="print()">Print</button>
          <a mat-stroked-button [href]="'/api/admin/runs/' + s.run.id + '/print-sheet.csv'" download>Download CSV</a>
        </p>
      }
    </section>
  `,
  styles: `
    table {
      width: 100%;
      border-collapse: collapse;
      margin: 16px 0;
    }
    th,
    td {
      text-align: left;
      padding: 6px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .kind {
      font-weight: 600;
    }
    .kind.final {
      color: var(--ps-igniter-text);
    }
    a[mat-stroked-button] {
      margin-left: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintSheetPage {
  private readonly api = inject(ShopAdminApi);
  readonly id = input.required({ transform: numberAttribute });
  protected readonly sheet = rxResource({
    params: () => this.id(),
    stream: ({ params }) => this.api.printSheet(params),
  });

  protected print(): void {
    window.print();
  }
}
