import { Router } from 'express';
import { z } from 'zod';
import { OrderQuery, RefundBody, ShipBody } from '../../contracts/shop/staff-order-schemas';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueService } from './catalogue-service';
import { ProductBody, ProductPatch } from './product-bodies';
import type { RunAdminService } from './run-admin-service';
import { NewRunBody, RunStateBody, ShippingMethodBody } from '../../contracts/shop/staff-shop-schemas';
import { toCsv } from '../platform/csv';
import type { FulfilmentService } from './fulfilment-service';
import type { RefundService } from './refund-service';
import { breakdownJson } from './refund-view';
import type { ShopConfigService } from './shop-config-service';
import { SHOP_SETTINGS, ShopSettingsSchema } from './shop-settings';
import type { StaffOrderService } from './staff-order-service';

const SHOP_STAFF = ['treasurer', 'admin'] as const;

// The client's key for one refund (the Idempotency-Key header): a retry with the same key gets the first answer.
const RequestKey = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_.:-]{8,120}$/, 'Use 8-120 letters, digits, dashes, dots, colons or underscores.')
  .optional();

export interface ShopAdminDeps {
  catalogue: CatalogueService;
  runs: RunAdminService;
  fulfilment: FulfilmentService;
  refunds: RefundService;
  orders: StaffOrderService;
  config: ShopConfigService;
  settings: SettingsService;
  timeZone: string;
}

/** /api/admin/orders: the table, CSV, detail, pack, ship, refund and its preview. */
export function orderAdminRoutes(d: ShopAdminDeps): Router {
  const r = Router();
  r.use(requireRole(...SHOP_STAFF));
  r.get('/', async function listOrders(req, res) {
    res.json(await d.orders.page(parse(OrderQuery, req.query)));
  });
  r.get('/export', async function exportOrders(req, res) {
    const csv = await d.orders.exportCsv(parse(OrderQuery, req.query));
    res.type('text/csv; charset=utf-8').attachment('padside-orders.csv');
    res.send(csv);
  });
  r.get('/:id', async function showOrderForStaff(req, res) {
    res.json({ order: await d.orders.detail(parse(fields.id, req.params.id)) });
  });
  r.post('/:id/pack', async function packOrder(req, res) {
    res.json({ order: await d.orders.view(await d.fulfilment.pack(parse(fields.id, req.params.id))) });
  });
  r.post('/:id/ship', async function shipOrder(req, res) {
    const id = parse(fields.id, req.params.id);
    const body = parse(ShipBody, req.body);
    res.json({ order: await d.orders.view(await d.fulfilment.ship(id, body.carrier, body.trackingNumber)) });
  });
  r.post('/:id/refund-preview', async function previewRefund(req, res) {
    const id = parse(fields.id, req.params.id);
    const body = parse(RefundBody, req.body);
    res.json({ refund: breakdownJson(await d.refunds.preview(id, { ...body, reason: body.reason ?? null })) });
  });
  r.post('/:id/refund', async function refundOrder(req, res) {
    const id = parse(fields.id, req.params.id);
    const body = parse(RefundBody, req.body);
    const key =
      parse(z.object({ 'idempotency-key': RequestKey }), { 'idempotency-key': req.header('idempotency-key') })[
        'idempotency-key'
      ] ?? null;
    const { bundle, refund } = await d.refunds.refund(id, { ...body, reason: body.reason ?? null }, key, req.user!.id);
    res.json(await d.orders.refunded(bundle, refund));
  });
  return r;
}

/** /api/admin/products: list, create, show, edit. Lists carry the club's time zone: staff type run windows in club time. */
export function productAdminRoutes(d: ShopAdminDeps): Router {
  const r = Router();
  r.use(requireRole(...SHOP_STAFF));
  r.get('/', async function listProductsForStaff(_req, res) {
    res.json({ items: await d.catalogue.listAll(), timeZone: d.timeZone });
  });
  r.post('/', async function createProduct(req, res) {
    res.status(201).json({ product: await d.catalogue.create(parse(ProductBody, req.body)) });
  });
  r.get('/:id', async function showProductForStaff(req, res) {
    res.json({ product: await d.catalogue.byId(parse(fields.id, req.params.id)) });
  });
  r.patch('/:id', async function editProduct(req, res) {
    const id = parse(fields.id, req.params.id);
    res.json({ product: await d.catalogue.update(id, parse(ProductPatch, req.body)) });
  });
  return r;
}

/** /api/admin/runs: list, add a product's next run, move state, print-run sheet (JSON and CSV). */
export function runAdminRoutes(d: ShopAdminDeps): Router {
  const r = Router();
  r.use(requireRole(...SHOP_STAFF));
  r.get('/', async function listRuns(_req, res) {
    res.json({ items: await d.runs.runs() });
  });
  r.post('/', async function addRun(req, res) {
    res.status(201).json({ run: await d.runs.createRun(parse(NewRunBody, req.body)) });
  });
  r.post('/:id/state', async function moveRun(req, res) {
    const id = parse(fields.id, req.params.id);
    res.json({ run: await d.runs.setRunState(id, parse(RunStateBody, req.body).state) });
  });
  r.get('/:id/print-sheet', async function printSheet(req, res) {
    res.json(await d.runs.printSheet(parse(fields.id, req.params.id)));
  });
  r.get('/:id/print-sheet.csv', async function printSheetCsv(req, res) {
    const s = await d.runs.printSheet(parse(fields.id, req.params.id));
    res.type('text/csv; charset=utf-8').attachment(`print-run-${s.run.id}.csv`);
    res.send(
      toCsv(
        ['SKU', 'Variant', 'Paid', 'Spares', 'To print'],
        [
          ...s.lines.map((l) => [l.sku, l.label, l.paid, l.spares, l.toPrint]),
          ['', 'Total', s.totalPaid, '', s.totalToPrint],
        ],
      ),
    );
  });
  return r;
}

/** /api/admin/shop: settings, shipping methods, the tax-rate table. */
export function shopSettingsRoutes(d: ShopAdminDeps): Router {
  const r = Router();
  r.use(requireRole(...SHOP_STAFF));
  r.get('/settings', async function showShopSettings(_req, res) {
    res.json({ settings: await d.settings.get(SHOP_SETTINGS) });
  });
  r.put('/settings', async function saveShopSettings(req, res) {
    res.json({ settings: await d.settings.put(SHOP_SETTINGS, parse(ShopSettingsSchema, req.body)) });
  });
  r.get('/shipping-methods', async function listShippingForStaff(_req, res) {
    res.json({ items: await d.config.allShippingMethods() });
  });
  r.put('/shipping-methods/:id', async function saveShippingMethod(req, res) {
    const id = parse(fields.id, req.params.id);
    res.json({ method: await d.config.saveShippingMethod(id, parse(ShippingMethodBody, req.body)) });
  });
  r.get('/tax-rates', async function listTaxRates(_req, res) {
    res.json({ items: await d.config.taxRateTable() });
  });
  return r;
}
