import PDFDocument from 'pdfkit';
import { formatCad } from '../platform/money';
import type { SponsorInvoice } from './sponsor-tax-service';

const KIND_LABELS: Record<string, string> = {
  build_log_credit: 'Build log credits',
  video_mention: 'Video mentions',
  logo_on_merch: 'Logo on merch',
  sponsors_page: 'Sponsors page listing',
  social_post: 'Social posts',
};

/**
 * The invoice for promotion a sponsor buys, as a PDF. pdfkit's built-in Helvetica (Latin-1): no font of wide
 * coverage ships in node_modules, so a name outside Latin-1 would print wrongly; the web page shows it right.
 */
export function sponsorInvoicePdf(inv: SponsorInvoice): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'LETTER', margin: 56, info: { Title: `Invoice ${inv.number}`, Author: 'Padside' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  doc.font('Helvetica-Bold').fontSize(18).text(`Invoice ${inv.number}`);
  doc.font('Helvetica').fontSize(11).text(inv.seller.name);
  if (inv.seller.gstHstRegistered && inv.seller.gstHstNumber) doc.text(`GST/HST registration number: ${inv.seller.gstHstNumber}`);
  doc.text(`Date: ${inv.date}`);
  doc.moveDown();
  doc.font('Helvetica-Bold').text('Billed to');
  doc.font('Helvetica').text(inv.sponsorName);
  doc.moveDown();
  doc.font('Helvetica-Bold').text(`Sponsorship promotion, season ${inv.season}`);
  doc.font('Helvetica').fontSize(10);
  for (const p of inv.promised) doc.text(`${KIND_LABELS[p.kind] ?? p.kind}: ${p.quantity}, due by ${p.dueOn}`);
  doc.moveDown();
  doc.fontSize(11).text(`Amount: ${formatCad(inv.amountCents)}`);
  if (!inv.taxes.length) doc.text('No GST/HST charged: the team is not registered for GST/HST.');
  for (const t of inv.taxes) doc.text(`${t.label}: ${formatCad(t.amountCents)}`);
  doc.font('Helvetica-Bold').text(`Total: ${formatCad(inv.totalCents)}`);
  doc.font('Helvetica').text(inv.paidOn ? `Paid on ${inv.paidOn}. Thank you.` : 'Payable on receipt.');
  doc.moveDown();
  doc.font('Helvetica-Oblique').fontSize(9).text(
    'Sponsorship that buys promotion is a taxable supply, not a donation; this invoice is not a donation receipt. The treatment follows the setting the team chose; the Canada Revenue Agency’s rules decide.',
  );
  doc.end();
  return done;
}
