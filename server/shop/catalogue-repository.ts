import type { Knex } from 'knex';
import type { ProductImage, SizeChart } from '../../contracts/shop/shop-answers';

export interface ProductRow {
  id: number;
  slug: string;
  name: string;
  description_md: string;
  price_cents: number;
  weight_grams: number;
  size_chart: SizeChart | null;
  images: ProductImage[];
  /** Units of this product one order may hold. */
  max_per_order: number;
  active: boolean;
  position: number;
}
export interface VariantRow {
  id: number;
  product_id: number;
  label: string;
  sku: string;
  weight_grams: number | null;
  price_cents: number | null;
  stock_on_hand: number | null;
  position: number;
}
export interface RunRow {
  id: number;
  product_id: number;
  name: string;
  cap: number;
  reserved: number;
  opens_at: Date;
  closes_at: Date;
  state: 'scheduled' | 'open' | 'closed' | 'in_production' | 'shipped';
  unit_cost_cents: number | null;
}
export interface VariantCapRow {
  run_id: number;
  variant_id: number;
  cap: number;
  reserved: number;
}

/** A product with everything the storefront shows about it. */
export interface ProductBundle {
  product: ProductRow;
  variants: VariantRow[];
  run: RunRow | null;
  caps: VariantCapRow[];
}

type JsonRun = Omit<RunRow, 'opens_at' | 'closes_at'> & { opens_at: string; closes_at: string };

/** Products, variants and runs as plain rows. */
export class CatalogueRepository {
  constructor(private readonly db: Knex) {}

  /**
   * Products with their variants, latest run and its variant caps, in one query (the storefront's every answer
   * starts here); `activeOnly` for the storefront, `variantIds` for the products a cart holds.
   */
  async bundles(
    where: { activeOnly?: boolean; slug?: string; id?: number; variantIds?: number[] } = {},
    db: Knex = this.db,
  ): Promise<ProductBundle[]> {
    const q = db('shop_products as p')
      .select(
        'p.*',
        db.raw(
          `coalesce((SELECT json_agg(json_build_object('id', v.id, 'product_id', v.product_id, 'label', v.label, 'sku', v.sku, 'weight_grams', v.weight_grams, 'price_cents', v.price_cents, 'stock_on_hand', v.stock_on_hand, 'position', v.position) ORDER BY v.position, v.id) FROM shop_variants v WHERE v.product_id = p.id), '[]') AS variants`,
        ),
        db.raw(
          `CASE WHEN r.id IS NULL THEN NULL ELSE json_build_object('id', r.id, 'product_id', r.product_id, 'name', r.name, 'cap', r.cap, 'reserved', r.reserved, 'opens_at', r.opens_at, 'closes_at', r.closes_at, 'state', r.state, 'unit_cost_cents', r.unit_cost_cents) END AS run`,
        ),
        db.raw(
          `coalesce((SELECT json_agg(json_build_object('run_id', c.run_id, 'variant_id', c.variant_id, 'cap', c.cap, 'reserved', c.reserved)) FROM shop_run_variant_caps c WHERE c.run_id = r.id), '[]') AS caps`,
        ),
      )
      .joinRaw(
        'LEFT JOIN LATERAL (SELECT * FROM shop_runs WHERE product_id = p.id ORDER BY opens_at DESC, id DESC LIMIT 1) r ON true',
      )
      .orderBy([{ column: 'p.position' }, { column: 'p.id' }]);
    if (where.activeOnly) q.where('p.active', true);
    if (where.slug) q.where('p.slug', where.slug);
    if (where.id) q.where('p.id', where.id);
    if (where.variantIds) q.whereIn('p.id', db('shop_variants').whereIn('id', where.variantIds).select('product_id'));
    const rows: (ProductRow & { variants: VariantRow[]; run: JsonRun | null; caps: VariantCapRow[] })[] = await q;
    return rows.map(({ variants, run, caps, ...product }) => ({
      product,
      variants,
      run: run && { ...run, opens_at: new Date(run.opens_at), closes_at: new Date(run.closes_at) },
      caps,
    }));
  }

  /** The bundles that hold these variants (for a quote). */
  async bundlesForVariants(variantIds: number[]): Promise<ProductBundle[]> {
    return variantIds.length ? this.bundles({ variantIds }) : [];
  }

  /** Adds a product with its variants in the caller's transaction, so a product never appears without its sizes. */
  async insertProduct(
    trx: Knex.Transaction,
    row: Omit<ProductRow, 'id' | 'position' | 'active' | 'max_per_order'> & { max_per_order?: number },
    variants: Omit<VariantRow, 'id' | 'product_id' | 'position'>[],
  ): Promise<number> {
    const [p] = await trx('shop_products')
      .insert({
        ...row,
        size_chart: row.size_chart ? JSON.stringify(row.size_chart) : null,
        images: JSON.stringify(row.images),
      })
      .returning('id');
    const productId = p.id;
    await trx('shop_variants').insert(variants.map((v, i) => ({ ...v, product_id: productId, position: i })));
    return productId;
  }

  /** Writes the given product columns in the caller's transaction; false when there is no such product. */
  async updateProduct(
    trx: Knex.Transaction,
    id: number,
    patch: Partial<
      Pick<
        ProductRow,
        | 'name'
        | 'description_md'
        | 'price_cents'
        | 'weight_grams'
        | 'size_chart'
        | 'images'
        | 'active'
        | 'max_per_order'
      >
    >,
  ): Promise<boolean> {
    const row: Record<string, unknown> = { ...patch, updated_at: trx.fn.now() };
    if (patch.size_chart !== undefined) row.size_chart = patch.size_chart ? JSON.stringify(patch.size_chart) : null;
    if (patch.images) row.images = JSON.stringify(patch.images);
    return (await trx('shop_products').where('id', id).update(row)) > 0;
  }

  /** Adds a print run with its per-variant caps in the caller's transaction, so a run never opens without its limits. */
  async insertRun(
    trx: Knex.Transaction,
    row: Omit<RunRow, 'id' | 'reserved' | 'state'>,
    caps: { variantId: number; cap: number }[],
  ): Promise<number> {
    const [r] = await trx('shop_runs')
      .insert({ ...row, state: 'scheduled' })
      .returning('id');
    const runId = r.id;
    if (caps.length)
      await trx('shop_run_variant_caps').insert(
        caps.map((c) => ({ run_id: runId, variant_id: c.variantId, cap: c.cap })),
      );
    return runId;
  }

  /** One print run by id. */
  async run(id: number): Promise<RunRow | null> {
    const r = await this.db<RunRow>('shop_runs').where('id', id).first();
    return r ?? null;
  }

  /** Every print run with its product's name and slug, newest opening first, for the staff list. */
  async runs(): Promise<(RunRow & { product_name: string; product_slug: string })[]> {
    const rows = await this.db('shop_runs as r')
      .join('shop_products as p', 'p.id', 'r.product_id')
      .select('r.*', 'p.name as product_name', 'p.slug as product_slug')
      .orderBy('r.opens_at', 'desc');
    return rows;
  }

  /** Moves a print run to a new state; the service decides which moves are allowed. */
  async setRunState(trx: Knex.Transaction, id: number, state: RunRow['state']): Promise<void> {
    await trx('shop_runs').where('id', id).update({ state });
  }

  /** Paid units per variant of a run (paid, packed or shipped orders, less units returned to stock). */
  async paidUnits(runId: number): Promise<Map<number, number>> {
    const rows = await this.db('shop_order_items as i')
      .join('shop_orders as o', 'o.id', 'i.order_id')
      .where('i.run_id', runId)
      .whereIn('o.status', ['paid', 'packed', 'shipped'])
      .groupBy('i.variant_id')
      .select('i.variant_id', this.db.raw('sum(i.quantity - i.restocked_quantity)::int as units'));
    return new Map(rows.map((r: { variant_id: number; units: number }) => [r.variant_id, r.units]));
  }

  /** Product addresses starting with `base`, so a new one can be made unique. */
  async slugsStartingWith(base: string): Promise<Set<string>> {
    return new Set(await this.db('shop_products').where('slug', 'like', `${base}%`).pluck('slug'));
  }

  /** The first of these SKUs some variant already uses; null when all are free. */
  async takenSku(skus: readonly string[]): Promise<string | null> {
    return (await this.db('shop_variants').whereIn('sku', skus).first('sku'))?.sku ?? null;
  }

  /** A product's variants in their order, id and label, to attach run caps named by label. */
  async variantLabels(trx: Knex.Transaction, productId: number): Promise<{ id: number; label: string }[]> {
    return trx('shop_variants').where('product_id', productId).orderBy('position').select('id', 'label');
  }

  /** Locks a product row for the transaction (so two staff cannot both add a run); null when there is none. */
  async lockProduct(trx: Knex.Transaction, id: number): Promise<{ id: number; name: string } | null> {
    return (await trx('shop_products').where('id', id).forUpdate().first('id', 'name')) ?? null;
  }

  /** Names of products whose pictures or description show one of `urls`. */
  async namesUsingImage(urls: readonly string[]): Promise<string[]> {
    const rows = await this.db('shop_products')
      .where((q) => {
        for (const url of urls) {
          q.orWhereRaw('images @> ?::jsonb', [JSON.stringify([{ url }])]).orWhereRaw('images @> ?::jsonb', [
            JSON.stringify([{ thumbnailUrl: url }]),
          ]);
          q.orWhere('description_md', 'like', `%${url}%`);
        }
      })
      .orderBy('name')
      .pluck('name');
    return rows as string[];
  }
}
