import { ChangeDetectionStrategy, Component, ElementRef, effect, inject, viewChild } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { CartLines } from './cart-lines';
import { CartStore } from './cart-store';

/** The cart sliding in from the right after "Add to cart"; Escape or the close button puts it away. */
@Component({
  selector: 'ps-cart-panel',
  imports: [RouterLink, MatButtonModule, MatIconModule, CartLines],
  template: `
    @if (cart.panelOpen()) {
      <div class="scrim" (click)="close()" aria-hidden="true"></div>
      <aside
        class="panel"
        role="dialog"
        aria-modal="true"
        aria-labelledby="cart-panel-title"
        (keydown.escape)="close()"
        tabindex="-1"
        #panel
      >
        <header>
          <h2 id="cart-panel-title">Your cart</h2>
          <button mat-icon-button type="button" (click)="close()" aria-label="Close the cart">
            <mat-icon>close</mat-icon>
          </button>
        </header>
        <ps-cart-lines />
        @if (cart.count()) {
          <a mat-flat-button routerLink="/shop/checkout" (click)="close()">Check out</a>
        }
      </aside>
    }
  `,
  styles: `
    .scrim {
      position: fixed;
      inset: 0;
      background: rgb(0 0 0 / 35%);
      z-index: 20;
    }
    .panel {
      position: fixed;
      top: 0;
      right: 0;
      bottom: 0;
      box-sizing: border-box;
      width: min(420px, 100vw);
      background: var(--mat-sys-surface);
      z-index: 21;
      padding: 16px 20px;
      overflow: auto;
      box-shadow: -8px 0 24px rgb(0 0 0 / 20%);
    }
    header {
      display: flex;
      justify-content: space-between;
      align-items: center;
    }
    a[mat-flat-button] {
      margin-top: 16px;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CartPanel {
  protected readonly cart = inject(CartStore);
  private readonly panel = viewChild<ElementRef<HTMLElement>>('panel');

  constructor() {
    // Focus moves into the panel when it opens, for keyboard and screen-reader users.
    effect(() => this.panel()?.nativeElement.focus());
  }

  protected close(): void {
    this.cart.panelOpen.set(false);
  }
}
