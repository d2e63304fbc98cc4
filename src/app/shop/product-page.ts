import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MoneyPipe } from '../shared/money-pipe';
import { CartPanel } from './cart-panel';
import { CartStore } from './cart-store';
import { RUN_STATE_LABELS, timeLeft } from './countdown';
import { ShopApi } from './shop-api';
import type { Variant } from './shop-types';

/** One product: pick a size, see units left and the time to close, add to the cart. */
@Component({
  selector: 'ps-product-page',
  imports: [RouterLink, MatButtonModule, MatButtonToggleModule, MatExpansionModule, MatFormFieldModule, MatInputModule, MoneyPipe, CartPanel],
  templateUrl: './product-page.html',
  styleUrl: './product-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductPage {
  private readonly api = inject(ShopApi);
  private readonly cart = inject(CartStore);
  readonly slug = input.required<string>();

  protected readonly product = rxResource({ params: () => this.slug(), stream: ({ params }) => this.api.product(params) });
  protected readonly chosenId = signal<number | null>(null);
  protected readonly quantity = signal(1);
  protected readonly added = signal(false);
  protected readonly stateLabel = RUN_STATE_LABELS;
  private readonly now = signal(Date.now());
  /** The countdown, refreshed every 30 seconds while the page is open. */
  protected readonly closesIn = computed(() => {
    const run = this.product.value()?.run;
    return run ? timeLeft(run.closesAt, this.now()) : '';
  });

  constructor() {
    const timer = setInterval(() => this.now.set(Date.now()), 30_000);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  protected readonly chosen = computed<Variant | null>(() => this.product.value()?.variants.find((v) => v.id === this.chosenId()) ?? null);
  protected readonly canAdd = computed(() => {
    const p = this.product.value();
    const v = this.chosen();
    return !!p && p.orderable && !!v && v.remaining >= this.quantity() && this.quantity() >= 1;
  });

  protected pick(id: number): void {
    this.chosenId.set(id);
    this.added.set(false);
  }

  protected setQuantity(value: string): void {
    const n = Math.floor(Number(value));
    this.quantity.set(Number.isFinite(n) ? Math.max(1, Math.min(20, n)) : 1);
  }

  protected add(): void {
    const p = this.product.value();
    const v = this.chosen();
    if (!p || !v || !this.canAdd()) return;
    this.cart.add({ variantId: v.id, quantity: this.quantity(), productName: p.name, variantLabel: v.label, slug: p.slug, priceCents: v.priceCents });
    this.added.set(true);
    this.cart.panelOpen.set(true);
  }
}
