import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { EmptyState } from '../shared/empty-state';
import { MoneyPipe } from '../shared/money-pipe';
import { CartStore } from './cart-store';

/** The cart's lines with quantity steppers; shared by the side panel and the cart page. */
@Component({
  selector: 'ps-cart-lines',
  imports: [RouterLink, MatButtonModule, MatIconModule, MoneyPipe, EmptyState],
  template: `
    @if (cart.lines().length) {
      <ul class="lines" role="list">
        @for (l of cart.lines(); track l.variantId) {
          <li>
            <div class="what">
              <a [routerLink]="['/shop/p', l.slug]">{{ l.productName }}</a>
              <span class="label">{{ l.variantLabel }}</span>
            </div>
            <div class="qty" role="group" [attr.aria-label]="'Quantity of ' + l.productName + ' ' + l.variantLabel">
              <button
                mat-icon-button
                type="button"
                (click)="cart.setQuantity(l.variantId, l.quantity - 1)"
                [attr.aria-label]="'One fewer ' + l.variantLabel"
              >
                <mat-icon>remove</mat-icon>
              </button>
              <span aria-live="polite">{{ l.quantity }}</span>
              <button
                mat-icon-button
                type="button"
                (click)="cart.setQuantity(l.variantId, l.quantity + 1)"
                [attr.aria-label]="'One more ' + l.variantLabel"
              >
                <mat-icon>add</mat-icon>
              </button>
            </div>
            <span class="sum">{{ l.priceCents * l.quantity | money }}</span>
          </li>
        }
      </ul>
      <p class="guide">
        Items: <strong>{{ cart.guideTotalCents() | money }}</strong>. Shipping, any member discount and tax are worked
        out at checkout.
      </p>
    } @else {
      <ps-empty-state icon="shopping_bag" message="Your cart is empty."
        ><a mat-stroked-button routerLink="/shop">See the merch</a></ps-empty-state
      >
    }
  `,
  styles: `
    .lines {
      list-style: none;
      padding: 0;
      margin: 0;
    }
    li {
      display: grid;
      grid-template-columns: 1fr auto auto;
      gap: 8px;
      align-items: center;
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .what {
      display: flex;
      flex-direction: column;
    }
    .label {
      font-size: 0.85rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .qty {
      display: flex;
      align-items: center;
    }
    .sum {
      min-width: 72px;
      text-align: right;
    }
    .guide {
      margin-top: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CartLines {
  protected readonly cart = inject(CartStore);
}
