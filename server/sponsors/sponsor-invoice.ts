import { formatCad } from '../platform/money';
import { newPdf } from '../platform/pdf-document';
import type { SponsorInvoice } from './sponsor-tax-service';

const KIND_LABELS: Record<string, string> = {
  build_log_credit: 'Build log credits',
  video_mention: 'Video mentions',
  logo_on_merch: 'Logo on merch',
  sponsors_page: 'Sponsors page listing',
  social_post: 'Social posts',
};

/** The invoice for promotion a sponsor buys, as a PDF, in DejaVu Sans so every name prints as typed. */
export function sponsorInvoicePdf(inv: SponsorInvoice): Promise<Buffer> {
  const { doc, done } = newPdf(`Invoice ${inv.number}`);

  doc.font('bold').fontSize(18).text(`Invoice ${inv.number}`);
  doc.font('body').fontSize(11).text(inv.seller.name);
  if (inv.seller.gstHstRegistered && inv.seller.gstHstNumber)
    doc.text(`GST/HST registration number: ${inv.seller.gstHstNumber}`);
  doc.text(`Date: ${inv.date}`);
  doc.moveDown();
  doc.font('bold').text('Billed to');
  doc.font('body').text(inv.sponsorName);
  doc.moveDown();
  doc.font('bold').text(`Sponsorship promotion, season ${inv.season}`);
  doc.font('body').fontSize(10);
  for (const p of inv.promised) doc.text(`${KIND_LABELS[p.kind] ?? p.kind}: ${p.quantity}, due by ${p.dueOn}`);
  doc.moveDown();
  doc.fontSize(11).text(`Amount: ${formatCad(inv.amountCents)}`);
  if (!inv.taxes.length) doc.text('No GST/HST charged: the team is not registered for GST/HST.');
  for (const t of inv.taxes) doc.text(`${t.label}: ${formatCad(t.amountCents)}`);
  doc.font('bold').text(`Total: ${formatCad(inv.totalCents)}`);
  doc.font('body').text(inv.paidOn ? `Paid on ${inv.paidOn}. Thank you.` : 'Payable on receipt.');
  doc.moveDown();
  doc
    .font('italic')
    .fontSize(9)
    .text(
      'Sponsorship that buys promotion is a taxable supply, not a donation; this invoice is not a donation receipt. The treatment follows the setting the team chose; the Canada Revenue Agency’s rules decide.',
    );
  doc.end();
  return done;
}
