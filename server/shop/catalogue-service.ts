import type { Knex } from 'knex';
import { z } from 'zod';
import type { ProductDetail } from '../../contracts/shop/shop-answers';
import type { PrintSheet, StaffRun } from '../../contracts/shop/staff-shop-answers';
import { refuseUnrenderable } from '../markdown/markdown-field';
import { renderMarkdown } from '../markdown/render-markdown';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { readyJson, type NotifiedCache, type ReadyJson } from '../platform/notified-cache';
import { fields } from '../platform/validate';
import { slugify, uniqueSlug } from '../platform/slug';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueRepository, ProductBundle } from './catalogue-repository';
import { printQuantities } from './print-sheet';
import { productView, viewValidity } from './product-view';
import { effectiveRunState, nextRunStates, type StoredRunState } from './run-state';
import { SHOP_SETTINGS } from './shop-settings';

const name = z
  .string({ error: 'Name is required.' })
  .trim()
  .min(2, 'Use at least 2 characters.')
  .max(120, 'At most 120 characters.');
const instant = z.iso.datetime({ offset: true, error: 'Use a date and time such as 2026-12-01T09:00:00-06:00.' });

const RunFields = z.object({
  name: z.string().trim().max(120).optional(),
  cap: z.number({ error: 'Enter a cap.' }).int().min(1, 'At least 1.').max(100000, 'At most 100,000.'),
  opensAt: instant,
  closesAt: instant,
  unitCostCents: fields.cents.optional(),
});

export const ProductBody = z.object({
  name,
  description: z.string().max(20000, 'At most 20,000 characters.').superRefine(refuseUnrenderable).default(''),
  priceCents: fields.cents.min(50, 'At least $0.50 (the card processor minimum).'),
  weightGrams: z
    .number({ error: 'Enter a weight in grams.' })
    .int('Whole grams.')
    .min(1, 'At least 1 g.')
    .max(20000, 'At most 20 kg.'),
  sizeChart: z
    .object({
      columns: z.array(z.string().max(40)).min(1).max(10),
      rows: z.array(z.array(z.string().max(40)).max(10)).max(20),
    })
    .nullable()
    .default(null),
  maxPerOrder: z
    .number({ error: 'Enter a number of units.' })
    .int('Whole units only.')
    .min(1, 'At least 1.')
    .max(100, 'At most 100.')
    .default(20),
  images: z
    .array(
      z.object({
        url: z.string().regex(/^\/uploads\/[a-z0-9-]+\.(jpg|png|webp|gif)$/, 'Use an uploaded image.'),
        thumbnailUrl: z.string().regex(/^\/uploads\/[a-z0-9-]+\.(jpg|png|webp|gif)$/, 'Use an uploaded image.'),
        alt: z.string().trim().max(200),
        width: z.number().int().min(1).max(20000).optional(),
        height: z.number().int().min(1).max(20000).optional(),
      }),
    )
    .max(8)
    .default([]),
  variants: z
    .array(
      z.object({
        label: z.string({ error: 'Label is required.' }).trim().min(1, 'Label is required.').max(60),
        sku: z
          .string()
          .trim()
          .regex(/^[A-Z0-9-]{2,60}$/i, 'Letters, digits and dashes.')
          .optional(),
        weightGrams: z.number().int().min(1).max(20000).optional(),
        priceCents: fields.cents.optional(),
        stock: z.number().int().min(0).max(100000).optional(),
      }),
    )
    .min(1, 'Add at least one variant.')
    .max(30),
  run: RunFields.extend({ variantCaps: z.record(z.string(), z.number().int().min(0)).optional() }).optional(),
});
export type ProductInput = z.infer<typeof ProductBody>;

/** A further run of a product that already sells in runs (a new season's batch). */
export const RunBody = RunFields.extend({
  productId: fields.id,
  variantCaps: z
    .array(
      z.object({
        variantId: fields.id,
        cap: z.number({ error: 'Enter a cap.' }).int().min(0, 'At least 0.').max(100000),
      }),
    )
    .max(30)
    .default([]),
});

export const ProductPatch = z.object({
  name: name.optional(),
  description: z.string().max(20000, 'At most 20,000 characters.').superRefine(refuseUnrenderable).optional(),
  priceCents: fields.cents.min(50).optional(),
  active: z.boolean().optional(),
  sizeChart: ProductBody.shape.sizeChart.optional(),
  images: ProductBody.shape.images.optional(),
  maxPerOrder: ProductBody.shape.maxPerOrder.unwrap().optional(),
});

/** The catalogue for buyers and staff, runs and their print sheets. */
export class CatalogueService {
  constructor(
    private readonly db: Knex,
    private readonly repo: CatalogueRepository,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
    /** The storefront's answers, dropped by any commit to the catalogue's tables (see the shop_catalogue trigger). */
    private readonly storefront: NotifiedCache<ReadyJson>,
  ) {}

  /** Every product, hidden ones too, as staff list them. */
  async listAll() {
    const now = this.clock.now();
    return (await this.repo.bundles()).map((b) => ({ ...productView(b, now), active: b.product.active }));
  }

  /** The storefront's product list, `{items}`, as ready JSON. */
  async storefrontList(): Promise<ReadyJson> {
    const ready = await this.storefront.get('list', this.clock.now(), async (now) => {
      const bundles = await this.repo.bundles({ activeOnly: true });
      return {
        value: readyJson({ items: bundles.map((b) => ({ ...productView(b, now), active: true })) }),
        ...viewValidity(bundles, now),
      };
    });
    return ready!;
  }

  /** One product's page as ready JSON; 404 for a product that does not exist or is not on sale. */
  async storefrontProduct(slug: string): Promise<ReadyJson> {
    const ready = await this.storefront.get(`product:${slug}`, this.clock.now(), async (now) => {
      const [b] = await this.repo.bundles({ activeOnly: true, slug });
      return b ? { value: readyJson(this.detail(b, now)), ...viewValidity([b], now) } : null;
    });
    if (!ready) throw notFound('No such product.');
    return ready;
  }

  /** One product as staff edit it, hidden or not, with its Markdown description. */
  async byId(id: number) {
    const [b] = await this.repo.bundles({ id });
    if (!b) throw notFound('No such product.');
    return { ...this.detail(b), active: b.product.active, description: b.product.description_md };
  }

  private detail(b: ProductBundle, now = this.clock.now()): ProductDetail {
    return { ...productView(b, now), descriptionHtml: renderMarkdown(b.product.description_md) };
  }

  /** Creates a product with its variants and, optionally, its first limited run. */
  async create(input: ProductInput) {
    if (input.run && new Date(input.run.closesAt) <= new Date(input.run.opensAt))
      throw badRequest('The run must close after it opens.', { 'run.closesAt': 'Must be after the opening.' });
    const base = slugify(input.name, 70);
    const slug = uniqueSlug(base, await this.repo.slugsStartingWith(base));
    const skus = input.variants.map((v, i) =>
      (v.sku ?? `${base.slice(0, 20)}-${slugify(v.label)}-${i + 1}`).toUpperCase(),
    );
    if (new Set(skus).size !== skus.length)
      throw badRequest('Each variant needs its own SKU.', { variants: 'Two variants share a SKU.' });
    const clash = await this.repo.takenSku(skus);
    if (clash) throw conflict('sku_taken', 'A SKU is already in use.', { variants: `SKU ${clash} is already in use.` });
    const id = await this.db.transaction(async (trx) => {
      const productId = await this.repo.insertProduct(
        trx,
        {
          slug,
          name: input.name,
          description_md: input.description,
          price_cents: input.priceCents,
          weight_grams: input.weightGrams,
          size_chart: input.sizeChart,
          images: input.images,
          max_per_order: input.maxPerOrder,
        },
        input.variants.map((v, i) => ({
          label: v.label,
          sku: skus[i],
          weight_grams: v.weightGrams ?? null,
          price_cents: v.priceCents ?? null,
          stock_on_hand: input.run ? null : (v.stock ?? 0),
        })),
      );
      if (input.run) {
        const variants = await this.repo.variantLabels(trx, productId);
        const caps = Object.entries(input.run.variantCaps ?? {})
          .map(([label, cap]) => ({ variantId: variants.find((v) => v.label === label)?.id ?? 0, cap }))
          .filter((c) => c.variantId);
        await this.repo.insertRun(
          trx,
          {
            product_id: productId,
            name: input.run.name || `${input.name} run`,
            cap: input.run.cap,
            opens_at: new Date(input.run.opensAt),
            closes_at: new Date(input.run.closesAt),
            unit_cost_cents: input.run.unitCostCents ?? null,
          },
          caps,
        );
      }
      return productId;
    });
    return this.byId(id);
  }

  /**
   * Opens a product's next run. The product's latest run is the one buyers see, so the new one must open after it
   * and may only be added once that run is over; the product row is locked so two staff cannot both add one.
   */
  async createRun(input: z.infer<typeof RunBody>) {
    if (new Date(input.closesAt) <= new Date(input.opensAt))
      throw badRequest('The run must close after it opens.', { closesAt: 'Must be after the opening.' });
    const runId = await this.db.transaction(async (trx) => {
      const product = await this.repo.lockProduct(trx, input.productId);
      if (!product) throw badRequest('Choose a product.', { productId: 'No such product.' });
      const [b] = await this.repo.bundles({ id: input.productId }, trx);
      if (!b.run)
        throw conflict('sold_from_stock', `${product.name} is sold from stock, not in runs.`, {
          productId: 'This product is sold from stock.',
        });
      const current = effectiveRunState(
        {
          state: b.run.state,
          cap: b.run.cap,
          reserved: b.run.reserved,
          opensAt: b.run.opens_at,
          closesAt: b.run.closes_at,
        },
        this.clock.now(),
      );
      if (current === 'scheduled' || current === 'open' || current === 'sold_out')
        throw conflict('run_not_over', `Close “${b.run.name}” before adding the next run.`, {
          productId: 'Its current run is not closed yet.',
        });
      if (new Date(input.opensAt) <= b.run.opens_at)
        throw badRequest('The new run must open after the last one opened.', {
          opensAt: 'Must be after the last run opened.',
        });
      const variantIds = new Set(b.variants.map((v) => v.id));
      const stray = input.variantCaps.find((c) => !variantIds.has(c.variantId));
      if (stray)
        throw badRequest('A size cap names a variant of another product.', {
          variantCaps: `Variant ${stray.variantId} is not one of ${product.name}'s.`,
        });
      return this.repo.insertRun(
        trx,
        {
          product_id: input.productId,
          name: input.name || `${product.name} run`,
          cap: input.cap,
          opens_at: new Date(input.opensAt),
          closes_at: new Date(input.closesAt),
          unit_cost_cents: input.unitCostCents ?? null,
        },
        input.variantCaps,
      );
    });
    return (await this.runs()).find((r) => r.id === runId)!;
  }

  /** Saves staff edits to a product and answers with the product as it now is. */
  async update(id: number, patch: z.infer<typeof ProductPatch>) {
    const ok = await this.repo.updateProduct(id, {
      name: patch.name,
      description_md: patch.description,
      price_cents: patch.priceCents,
      active: patch.active,
      size_chart: patch.sizeChart,
      images: patch.images,
      max_per_order: patch.maxPerOrder,
    });
    if (!ok) throw notFound('No such product.');
    return this.byId(id);
  }

  /** Every print run with the state its dates and cap give now, so staff see a run close on time without a job. */
  async runs(): Promise<StaffRun[]> {
    const now = this.clock.now();
    return (await this.repo.runs()).map((r) => {
      const state = effectiveRunState(
        { state: r.state, cap: r.cap, reserved: r.reserved, opensAt: r.opens_at, closesAt: r.closes_at },
        now,
      );
      return {
        id: r.id,
        name: r.name,
        productName: r.product_name,
        productSlug: r.product_slug,
        state,
        nextStates: nextRunStates(state),
        cap: r.cap,
        reserved: r.reserved,
        remaining: r.cap - r.reserved,
        opensAt: r.opens_at.toISOString(),
        closesAt: r.closes_at.toISOString(),
        unitCostCents: r.unit_cost_cents,
      };
    });
  }

  /** Moves a run forward by hand (close early, into production, shipped). */
  async setRunState(id: number, state: StoredRunState) {
    const run = await this.repo.run(id);
    if (!run) throw notFound('No such run.');
    const now = effectiveRunState(
      { state: run.state, cap: run.cap, reserved: run.reserved, opensAt: run.opens_at, closesAt: run.closes_at },
      this.clock.now(),
    );
    if (!nextRunStates(now).includes(state))
      throw conflict(
        'wrong_state',
        `A run that is ${now.replace('_', ' ')} cannot move to ${state.replace('_', ' ')}.`,
        { state: 'Not allowed from the current state.' },
      );
    await this.db.transaction((trx) => this.repo.setRunState(trx, id, state));
    return (await this.runs()).find((r) => r.id === id)!;
  }

  /** Per variant: paid units, spares and pieces to print; a preview while orders can still arrive. */
  async printSheet(id: number): Promise<PrintSheet> {
    const run = await this.repo.run(id);
    if (!run) throw notFound('No such run.');
    const [b] = await this.repo.bundles({ id: run.product_id });
    const state = effectiveRunState(
      { state: run.state, cap: run.cap, reserved: run.reserved, opensAt: run.opens_at, closesAt: run.closes_at },
      this.clock.now(),
    );
    const rules = await this.settings.get(SHOP_SETTINGS);
    const paid = await this.repo.paidUnits(id);
    const sheet = printQuantities(
      b.variants.map((v) => ({ variantId: v.id, label: v.label, sku: v.sku, paid: paid.get(v.id) ?? 0 })),
      rules,
    );
    return {
      run: {
        id: run.id,
        name: run.name,
        productName: b.product.name,
        state,
        cap: run.cap,
        opensAt: run.opens_at.toISOString(),
        closesAt: run.closes_at.toISOString(),
      },
      kind:
        state === 'scheduled' || state === 'open' || state === 'sold_out' ? ('preview' as const) : ('final' as const),
      rules: {
        sparesPercent: rules.sparesPercent,
        packMultiple: rules.packMultiple,
        minimumPerDesign: rules.minimumPerDesign,
      },
      lines: sheet.lines,
      totalPaid: sheet.totalPaid,
      totalToPrint: sheet.totalToPrint,
      unitCostCents: run.unit_cost_cents,
      estimatedCostCents: run.unit_cost_cents === null ? null : run.unit_cost_cents * sheet.totalToPrint,
    };
  }
}
