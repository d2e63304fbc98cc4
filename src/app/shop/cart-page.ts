import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { CartLines } from './cart-lines';
import { CartStore } from './cart-store';

/** /shop/cart: the cart on its own page (the top bar's bag icon). */
@Component({
  selector: 'ps-cart-page',
  imports: [RouterLink, MatButtonModule, CartLines],
  template: `
    <section class="ps-narrow">
      <h1>Your cart</h1>
      <ps-cart-lines />
      @if (cart.count()) {
        <p><a mat-flat-button routerLink="/shop/checkout">Check out</a></p>
      }
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CartPage {
  protected readonly cart = inject(CartStore);
}
