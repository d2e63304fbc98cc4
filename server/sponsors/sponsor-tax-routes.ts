import { Router } from 'express';
import { requireRole } from '../platform/require-role';
import { fields, parse } from '../platform/validate';
import { TaxTreatmentBody } from '../../contracts/sponsors/sponsor-schemas';
import { sponsorInvoicePdf } from './sponsor-invoice';
import type { SponsorTaxService } from './sponsor-tax-service';

const MONEY = ['treasurer', 'admin'] as const;

/** /api/admin/sponsors/agreements/:agreementId: the tax treatment and the invoice (treasurer and admin). */
export function sponsorTaxRoutes(taxes: SponsorTaxService, today: () => string): Router {
  const r = Router();
  r.put('/agreements/:agreementId/tax-treatment', requireRole(...MONEY), async function setTaxTreatment(req, res) {
    res.json(await taxes.setTreatment(parse(fields.id, req.params.agreementId), parse(TaxTreatmentBody, req.body)));
  });
  r.get('/agreements/:agreementId/invoice.pdf', requireRole(...MONEY), async function sponsorInvoice(req, res) {
    const invoice = await taxes.invoice(parse(fields.id, req.params.agreementId), today());
    const pdf = await sponsorInvoicePdf(invoice);
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Disposition': `attachment; filename="invoice-${invoice.number}.pdf"`,
    });
    res.send(pdf);
  });
  return r;
}
