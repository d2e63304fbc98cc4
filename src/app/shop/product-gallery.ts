import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { ProductImage } from '@contracts/shop/shop-answers';

/** How far a finger must travel sideways before it counts as a swipe, in CSS pixels (common practice, no source). */
const SWIPE_PX = 40;

/** The product's photos: swipe on a phone, arrows, thumbnails and the arrow keys everywhere; a drawn mark without any. */
@Component({
  selector: 'ps-product-gallery',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './product-gallery.html',
  styleUrl: './product-gallery.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductGallery {
  readonly images = input.required<ProductImage[]>();
  /** The product's name, for the placeholder mark and the labels. */
  readonly name = input.required<string>();

  protected readonly index = signal(0);
  protected readonly current = computed(() => this.images()[Math.min(this.index(), this.images().length - 1)] ?? null);
  private swipeFrom: number | null = null;

  /** The srcset of one photo: its 480 px WebP copy and the full image. */
  static srcset(img: ProductImage): string {
    return img.width ? `${img.thumbnailUrl} 480w, ${img.url} ${img.width}w` : `${img.thumbnailUrl} 480w`;
  }
  /** How wide the main photo shows (the page's preload says the same, so the browser fetches one copy). */
  static readonly SIZES = '(max-width: 800px) 100vw, 50vw';
  protected readonly srcset = ProductGallery.srcset;
  protected readonly sizes = ProductGallery.SIZES;

  protected show(i: number): void {
    const n = this.images().length;
    if (n) this.index.set(((i % n) + n) % n);
  }

  protected step(by: number): void {
    this.show(this.index() + by);
  }

  protected keydown(e: KeyboardEvent): void {
    if (e.key === 'ArrowRight') this.step(1);
    else if (e.key === 'ArrowLeft') this.step(-1);
    else return;
    e.preventDefault();
  }

  protected pointerDown(e: PointerEvent): void {
    this.swipeFrom = e.clientX;
  }

  protected pointerUp(e: PointerEvent): void {
    if (this.swipeFrom === null) return;
    const dx = e.clientX - this.swipeFrom;
    this.swipeFrom = null;
    if (Math.abs(dx) >= SWIPE_PX) this.step(dx < 0 ? 1 : -1);
  }
}
