import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { SignUpForm } from '../announcements/sign-up-form';
import { PageMeta, SHARE_IMAGE } from '../core/page-meta';
import { isNotFound, loadErrorStatus } from '../core/rendering/load-error-status';
import { clip, plainText, productData } from '../core/structured-data';
import { SiteNames } from '../core/site-names';
import { MoneyPipe } from '../shared/money-pipe';
import { CartPanel } from './cart-panel';
import { ProductGallery } from './product-gallery';
import { CartStore } from './cart-store';
import { RUN_STATE_LABELS, timeLeft } from './countdown';
import { ShopApi } from './shop-api';
import type { Variant } from '@contracts/shop/shop-answers';

/** One product: pick a size, see units left and the time to close, add to the cart. */
@Component({
  selector: 'ps-product-page',
  imports: [
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MoneyPipe,
    CartPanel,
    ProductGallery,
    SignUpForm,
  ],
  templateUrl: './product-page.html',
  styleUrl: './product-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductPage {
  private readonly api = inject(ShopApi);
  private readonly cart = inject(CartStore);
  readonly slug = input.required<string>();

  protected readonly product = rxResource({
    params: () => this.slug(),
    stream: ({ params }) => this.api.product(params),
  });
  /** The product once loaded; value() itself throws while the resource holds an error (an unknown address). */
  private readonly loaded = computed(() => (this.product.hasValue() ? this.product.value() : undefined));
  /** The API said there is no such product; any other failure is worth a retry. */
  protected readonly missing = computed(() => isNotFound(this.product.error()));
  private readonly pickedId = signal<number | null>(null);
  /** The buyer's pick, or the product's sole option when there is nothing to choose. */
  protected readonly chosenId = computed(() => {
    const variants = this.loaded()?.variants ?? [];
    return this.pickedId() ?? (variants.length === 1 && variants[0].remaining > 0 ? variants[0].id : null);
  });
  protected readonly quantity = signal(1);
  /** What became of the typed quantity, said beside the field: capped at the limit, or refused. */
  protected readonly quantityNote = signal<{ kind: 'capped' | 'refused'; text: string } | null>(null);
  /** What "Add to cart" did, said beside the button. */
  protected readonly added = signal<string | null>(null);
  protected readonly limit = computed(() => this.loaded()?.maxPerOrder ?? 20);
  protected readonly stateLabel = RUN_STATE_LABELS;
  private readonly now = signal(Date.now());
  /** The countdown, refreshed every 30 seconds while the page is open. */
  protected readonly closesIn = computed(() => {
    const run = this.loaded()?.run;
    return run ? timeLeft(run.closesAt, this.now()) : '';
  });

  constructor() {
    const meta = inject(PageMeta);
    const site = inject(SiteNames);
    const answerLoadError = loadErrorStatus();
    effect(() => {
      answerLoadError(this.product.error());
      const p = this.loaded();
      if (!p) return;
      const photo = p.images[0];
      const path = `/shop/p/${p.slug}`;
      const description = clip(plainText(p.descriptionHtml)) || p.name;
      meta.describe({
        title: p.name,
        description,
        path,
        type: 'product',
        image: photo ? { url: photo.url, width: photo.width, height: photo.height, alt: photo.alt } : null,
        preload: photo ? { href: photo.url, srcset: ProductGallery.srcset(photo), sizes: ProductGallery.SIZES } : null,
        data: productData(
          p,
          meta.absolute(path),
          (p.images.length ? p.images.map((i) => i.url) : [SHARE_IMAGE.url]).map((u) => meta.absolute(u)),
          site.teamName(),
        ),
      });
    });
    const timer = setInterval(() => this.now.set(Date.now()), 30_000);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  protected readonly chosen = computed<Variant | null>(
    () => this.loaded()?.variants.find((v) => v.id === this.chosenId()) ?? null,
  );
  protected readonly canAdd = computed(() => {
    const p = this.loaded();
    const v = this.chosen();
    return (
      !!p &&
      p.orderable &&
      !!v &&
      v.remaining >= this.quantity() &&
      this.quantity() >= 1 &&
      this.quantityNote()?.kind !== 'refused'
    );
  });

  protected pick(id: number): void {
    this.pickedId.set(id);
    this.added.set(null);
  }

  /** Takes the typed quantity: over the limit is capped (and said so), below 1 or not a whole number is refused. */
  protected setQuantity(input: HTMLInputElement): void {
    this.added.set(null);
    const n = Number(input.value);
    const max = this.limit();
    if (input.value.trim() === '' || !Number.isInteger(n) || n < 1) {
      this.quantityNote.set({ kind: 'refused', text: 'Enter a whole number of at least 1.' });
      return;
    }
    if (n > max) {
      this.quantity.set(max);
      input.value = String(max);
      this.quantityNote.set({ kind: 'capped', text: `Changed to ${max}: at most ${max} per order.` });
      return;
    }
    this.quantity.set(n);
    this.quantityNote.set(null);
  }

  protected add(): void {
    const p = this.loaded();
    const v = this.chosen();
    if (!p || !v || !this.canAdd()) return;
    const before = this.cart.lines().find((l) => l.variantId === v.id)?.quantity ?? 0;
    const now = this.cart.add({
      variantId: v.id,
      quantity: this.quantity(),
      productName: p.name,
      variantLabel: v.label,
      slug: p.slug,
      priceCents: v.priceCents,
      weightGrams: v.weightGrams,
      maxPerOrder: p.maxPerOrder,
    });
    const took = now - before;
    this.added.set(
      took < this.quantity()
        ? `Added ${took}: the cart now holds ${now}, the most one order may have.`
        : `Added ${took} to the cart.`,
    );
    this.cart.panelOpen.set(true);
  }
}
