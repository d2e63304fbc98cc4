import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RUN_MOVE_LABELS, RUN_STATE_LABELS } from '@contracts/labels/run-states';
import type { RunMove } from '@contracts/shop/staff-shop-answers';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { LabelPipe } from '../../shared/label-pipe';
import { ShopAdminApi } from '../orders/shop-admin-api';
import { RunForm } from './run-form';

/** Limited runs: how full, the window, the next step, the way to each print-run sheet, and a product's next run. */
@Component({
  selector: 'ps-run-list',
  imports: [ClubDatePipe, LabelPipe, RouterLink, MatButtonModule, MatProgressBarModule, EmptyState, RunForm],
  template: `
    <section class="ps-page">
      <h1>Runs</h1>
      @if (runs.value(); as items) {
        @if (items.length) {
          <table>
            <caption class="ps-visually-hidden">
              Limited runs
            </caption>
            <thead>
              <tr>
                <th scope="col">Run</th>
                <th scope="col">State</th>
                <th scope="col">Sold</th>
                <th scope="col">Window</th>
                <th scope="col">Actions</th>
              </tr>
            </thead>
            <tbody>
              @for (r of items; track r.id) {
                <tr>
                  <td>
                    <strong>{{ r.name }}</strong><br /><small>{{ r.productName }}</small>
                  </td>
                  <td>{{ r.state | label: stateLabels }}</td>
                  <td>
                    {{ r.reserved }} of {{ r.cap }}
                    <mat-progress-bar
                      mode="determinate"
                      [value]="(100 * r.reserved) / r.cap"
                      [attr.aria-label]="r.reserved + ' of ' + r.cap + ' sold'"
                    />
                  </td>
                  <td>{{ r.opensAt | clubDate }} – {{ r.closesAt | clubDate }}</td>
                  <td>
                    <a mat-stroked-button [routerLink]="['/console/runs', r.id, 'print-sheet']">Print-run sheet</a>
                    @for (s of r.nextStates; track s) {
                      <button mat-button type="button" (click)="move(r.id, s)">{{ s | label: moveLabels }}</button>
                    }
                  </td>
                </tr>
              }
            </tbody>
          </table>
        } @else {
          <ps-empty-state icon="checkroom" message="No runs yet. A run starts with its product on the Products page." />
        }
      }
      @if (runProducts().length && products.value(); as p) {
        <ps-run-form [products]="runProducts()" [timeZone]="p.timeZone" (added)="runs.reload(); products.reload()" />
      }
    </section>
  `,
  styles: `
    .ps-page {
      max-width: none;
    }
    table {
      width: 100%;
      border-collapse: collapse;
    }
    th,
    td {
      text-align: left;
      padding: 8px 6px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    mat-progress-bar {
      max-width: 160px;
      margin-top: 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunList {
  private readonly api = inject(ShopAdminApi);
  protected readonly runs = rxResource({ stream: () => this.api.runs() });
  protected readonly products = rxResource({ stream: () => this.api.products() });
  protected readonly runProducts = computed(() => (this.products.value()?.items ?? []).filter((p) => p.run !== null));
  protected readonly stateLabels = RUN_STATE_LABELS;
  protected readonly moveLabels = RUN_MOVE_LABELS;

  protected async move(id: number, state: RunMove): Promise<void> {
    await firstValueFrom(this.api.moveRun(id, state));
    this.runs.reload();
  }
}
