import type { Knex } from 'knex';
import type { PrintSheet, StaffRun } from '../../contracts/shop/staff-shop-answers';
import type { NewRunInput } from '../../contracts/shop/staff-shop-schemas';
import { badRequest, conflict, notFound } from '../platform/app-error';
import type { Clock } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueRepository } from './catalogue-repository';
import { printQuantities } from './print-sheet';
import { effectiveRunState, nextRunStates, type StoredRunState } from './run-state';
import { SHOP_SETTINGS } from './shop-settings';

/** Staff's print runs: adding a product's next run, moving runs on by hand, and their print sheets. */
export class RunAdminService {
  constructor(
    private readonly db: Knex,
    private readonly repo: CatalogueRepository,
    private readonly settings: SettingsService,
    private readonly clock: Clock,
  ) {}

  /**
   * Opens a product's next run. The product's latest run is the one buyers see, so the new one must open after it
   * and may only be added once that run is over; the product row is locked so two staff cannot both add one.
   */
  async createRun(input: NewRunInput) {
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
