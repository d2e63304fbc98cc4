import { isPlatformBrowser } from '@angular/common';
import { Injectable, PLATFORM_ID, computed, effect, inject, signal } from '@angular/core';

/** One line of the cart as the browser keeps it; prices shown here are only a guide until the server quotes. */
export interface CartLine {
  variantId: number;
  quantity: number;
  productName: string;
  variantLabel: string;
  slug: string;
  priceCents: number;
  /** Grams per unit, so checkout can price each shipping method before the quote. */
  weightGrams?: number;
  /** The product's per-order limit when the line was added (the server checks it again on every quote). */
  maxPerOrder?: number;
}

const KEY = 'padside.cart.v1';

function load(): CartLine[] {
  try {
    const raw = JSON.parse(localStorage.getItem(KEY) ?? '[]') as unknown;
    return Array.isArray(raw)
      ? raw.filter(
          (l): l is CartLine => typeof l?.variantId === 'number' && typeof l?.quantity === 'number' && l.quantity > 0,
        )
      : [];
  } catch {
    return [];
  }
}

/** The cart in signals, saved to localStorage so it survives a reload; the server checks it on every quote. */
@Injectable({ providedIn: 'root' })
export class CartStore {
  /** The server renders as a visitor with nothing in the cart; the browser's own cart fills in when it starts. */
  private readonly browser = isPlatformBrowser(inject(PLATFORM_ID));
  private readonly state = signal<CartLine[]>(this.browser ? load() : []);
  readonly lines = this.state.asReadonly();
  readonly count = computed(() => this.state().reduce((s, l) => s + l.quantity, 0));
  readonly guideTotalCents = computed(() => this.state().reduce((s, l) => s + l.priceCents * l.quantity, 0));
  /** The parcel's weight, or null while a line saved by an older version has no weight. */
  readonly weightGrams = computed(() =>
    this.state().every((l) => l.weightGrams !== undefined)
      ? this.state().reduce((s, l) => s + (l.weightGrams ?? 0) * l.quantity, 0)
      : null,
  );
  /** Whether the side panel is showing. */
  readonly panelOpen = signal(false);

  constructor() {
    if (this.browser) effect(() => localStorage.setItem(KEY, JSON.stringify(this.state())));
  }

  /** Adds units, never past the line's per-order limit; returns how many the line now holds. */
  add(line: CartLine): number {
    const max = line.maxPerOrder ?? 20;
    this.state.update((lines) => {
      const found = lines.find((l) => l.variantId === line.variantId);
      return found
        ? lines.map((l) =>
            l === found ? { ...l, maxPerOrder: max, quantity: Math.min(max, l.quantity + line.quantity) } : l,
          )
        : [...lines, { ...line, quantity: Math.min(max, line.quantity) }];
    });
    return this.state().find((l) => l.variantId === line.variantId)!.quantity;
  }

  /** Sets a line's quantity within the per-order limit; zero or less removes it. */
  setQuantity(variantId: number, quantity: number): void {
    this.state.update((lines) =>
      quantity <= 0
        ? lines.filter((l) => l.variantId !== variantId)
        : lines.map((l) =>
            l.variantId === variantId ? { ...l, quantity: Math.min(l.maxPerOrder ?? 20, quantity) } : l,
          ),
    );
  }

  /** Empties the cart (after an order is paid). */
  clear(): void {
    this.state.set([]);
  }
}
