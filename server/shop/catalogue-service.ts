import type { Knex } from 'knex';
import type { ProductDetail } from '../../contracts/shop/shop-answers';
import { renderMarkdown } from '../markdown/render-markdown';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import { readyJson, type NotifiedCache, type ReadyJson } from '../platform/notified-cache';
import { slugify, uniqueSlug } from '../platform/slug';
import type { CatalogueRepository, ProductBundle } from './catalogue-repository';
import type { ProductEdit, ProductInput } from './product-bodies';
import { productView, viewValidity } from './product-view';

/** The catalogue for buyers and staff: the storefront's reads and staff product editing (runs: run-admin-service). */
export class CatalogueService {
  constructor(
    private readonly db: Knex,
    private readonly repo: CatalogueRepository,
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

  /** Saves staff edits to a product and answers with the product as it now is. */
  async update(id: number, patch: ProductEdit) {
    const ok = await this.db.transaction((trx) =>
      this.repo.updateProduct(trx, id, {
        name: patch.name,
        description_md: patch.description,
        price_cents: patch.priceCents,
        active: patch.active,
        size_chart: patch.sizeChart,
        images: patch.images,
        max_per_order: patch.maxPerOrder,
      }),
    );
    if (!ok) throw notFound('No such product.');
    return this.byId(id);
  }
}
