import { Router } from 'express';
import { z } from 'zod';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import type { BooksService } from './books-service';
import { DateRangeQuery, FeePercentBody } from '../../contracts/books/books-schemas';
import { fromFeePercent, toFeePercent } from './fee-percent';

function sendCsv(res: import('express').Response, name: string): void {
  res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': `attachment; filename="${name}"` });
}

/** Reports under /api/admin/reports and the dashboard numbers (treasurer and admin). */
export function reportRoutes(books: BooksService): Router {
  const r = Router();
  r.use(requireRole('treasurer', 'admin'));

  r.get('/tax', async function taxReport(req, res) {
    res.json(await books.taxReport(parse(DateRangeQuery, req.query)));
  });

  r.get('/tax.csv', async function taxCsv(req, res) {
    const range = parse(DateRangeQuery, req.query);
    const csv = await books.taxCsv(range);
    sendCsv(res, `padside-tax-${range.from}-to-${range.to}.csv`);
    res.send(csv);
  });

  r.get('/revenue', async function revenue(req, res) {
    res.json(await books.revenue(parse(DateRangeQuery, req.query)));
  });

  r.get('/ledger.csv', async function ledgerCsv(req, res) {
    const range = parse(DateRangeQuery, req.query);
    const chunks = books.ledgerCsv(range);
    // Pull the first chunk before the headers go out, so a bad range still answers with a JSON 400.
    const first = await chunks.next();
    sendCsv(res, `padside-ledger-${range.from}-to-${range.to}.csv`);
    if (!first.done) res.write(first.value);
    for await (const chunk of chunks) res.write(chunk);
    res.end();
  });

  r.get('/sponsor-value', async function sponsorValue(_req, res) {
    res.json(await books.sponsorValue());
  });

  r.get('/units-by-size', async function unitsBySize(req, res) {
    const { runId } = parse(z.object({ runId: fields.id }), req.query);
    res.json({ items: await books.unitsBySize(runId) });
  });

  return r;
}

/** GET /api/admin/dashboard (treasurer and admin). */
export function dashboardRoutes(books: BooksService): Router {
  const r = Router();
  r.get('/', requireRole('treasurer', 'admin'), async function dashboard(_req, res) {
    res.json(await books.dashboard());
  });
  return r;
}

/** The processor-fee estimate settings under /api/admin/settings/processor-fees, read and typed as percentages. */
export function feeSettingsRoutes(books: BooksService): Router {
  const r = Router();
  r.use(requireRole('treasurer', 'admin'));
  r.get('/', async function feeSettings(_req, res) {
    res.json(toFeePercent(await books.feeSettings()));
  });
  r.put('/', async function saveFeeSettings(req, res) {
    res.json(toFeePercent(await books.saveFeeSettings(fromFeePercent(parse(FeePercentBody, req.body)))));
  });
  return r;
}
