import type { Product } from '../../contracts/shop/shop-answers';
import type { ProductBundle } from './catalogue-repository';
import { effectiveRunState } from './run-state';

/** Units left of one variant: the run's and the variant's own cap for run products, stock otherwise. */
export function variantRemaining(b: ProductBundle, variantId: number): number {
  const v = b.variants.find((x) => x.id === variantId);
  if (!v) return 0;
  if (!b.run) return v.stock_on_hand ?? 0;
  const runLeft = b.run.cap - b.run.reserved;
  const cap = b.caps.find((c) => c.variant_id === variantId);
  return Math.max(0, cap ? Math.min(runLeft, cap.cap - cap.reserved) : runLeft);
}

/** Builds the view at `now` (the run's state depends on its window). */
export function productView(b: ProductBundle, now: Date): Product {
  const { product: p, run } = b;
  const state = run
    ? effectiveRunState(
        { state: run.state, cap: run.cap, reserved: run.reserved, opensAt: run.opens_at, closesAt: run.closes_at },
        now,
      )
    : null;
  return {
    id: p.id,
    slug: p.slug,
    name: p.name,
    priceCents: p.price_cents,
    currency: 'CAD',
    weightGrams: p.weight_grams,
    maxPerOrder: p.max_per_order,
    images: p.images,
    sizeChart: p.size_chart,
    orderable: p.active && (run ? state === 'open' : b.variants.some((v) => (v.stock_on_hand ?? 0) > 0)),
    run:
      run && state
        ? {
            id: run.id,
            name: run.name,
            state,
            cap: run.cap,
            remaining: Math.max(0, run.cap - run.reserved),
            opensAt: run.opens_at.toISOString(),
            closesAt: run.closes_at.toISOString(),
          }
        : null,
    variants: b.variants.map((v) => ({
      id: v.id,
      sku: v.sku,
      label: v.label,
      priceCents: v.price_cents ?? p.price_cents,
      weightGrams: v.weight_grams ?? p.weight_grams,
      remaining: variantRemaining(b, v.id),
    })),
  };
}

/**
 * The instants (ms) between which views built at `now` stay as they are while no row changes: a run's state moves
 * when it opens and when it closes.
 */
export function viewValidity(bundles: ProductBundle[], now: Date): { validFrom: number; validUntil: number } {
  const t = now.getTime();
  let validFrom = -Infinity;
  let validUntil = Infinity;
  for (const { run } of bundles) {
    for (const at of run ? [run.opens_at.getTime(), run.closes_at.getTime()] : []) {
      if (at <= t) validFrom = Math.max(validFrom, at);
      else validUntil = Math.min(validUntil, at);
    }
  }
  return { validFrom, validUntil };
}
