import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatCardModule } from '@angular/material/card';
import { MatChipsModule } from '@angular/material/chips';
import { SiteNames } from '../core/site-names';
import { EmptyState } from '../shared/empty-state';
import { MoneyPipe } from '../shared/money-pipe';
import { RUN_STATE_LABELS, timeLeft } from './countdown';
import { ShopApi } from './shop-api';
import { PageMeta } from '../core/page-meta';

/** Every product on sale, run products first with units left and time to close. */
@Component({
  selector: 'ps-product-grid',
  imports: [RouterLink, MatCardModule, MatChipsModule, MoneyPipe, EmptyState],
  templateUrl: './product-grid.html',
  styleUrl: './product-grid.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductGrid {
  constructor() {
    inject(PageMeta).describe({
      title: 'Merch',
      description: 'Limited-run merch: each run is printed once its order window closes.',
      path: '/shop',
      type: 'website',
    });
  }

  private readonly api = inject(ShopApi);
  protected readonly site = inject(SiteNames);
  protected readonly products = rxResource({ stream: () => this.api.products() });
  protected readonly stateLabel = RUN_STATE_LABELS;
  protected readonly now = Date.now();
  protected readonly timeLeft = timeLeft;
}
