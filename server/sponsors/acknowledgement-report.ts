import { isoDateInZone } from '../../contracts/dates/club-dates';
import { DELIVERABLE_KIND_LABELS } from '../../contracts/labels/deliverable-kinds';
import { labelOf } from '../../contracts/labels/label-of';
import { centsToDecimal, inDateOrder, toCsv, zonedHeader } from '../platform/csv';
import { formatCad } from '../platform/money';
import { newPdf } from '../platform/pdf-document';
import type { AgreementView, CreditView, SponsorView } from './sponsor-views';

/** What the report says about itself, in Padside's words; the PDF and the CSV carry the same sentence. */
const notAReceipt = (teamName: string) =>
  `This report acknowledges the support listed below and the credits ${teamName} delivered in return. It is not an official donation receipt for income tax purposes: ` +
  'in Canada only registered charities and other qualified donees issue those. For how sponsorship is treated for tax, ask the Canada Revenue Agency or your accountant.';

export interface ReportData {
  sponsor: SponsorView;
  agreements: AgreementView[];
  credits: CreditView[];
  generatedOn: string;
  teamName: string;
  /** The club's zone: a credit's date is the club-time date it was published. */
  timeZone: string;
}

/** The acknowledgement report as CSV: one row per support item and one per credit, in date order, then the note. */
export function acknowledgementCsv(r: ReportData): string {
  const rows: (string | number | null)[][] = [];
  for (const a of r.agreements) {
    if (a.cashCents) rows.push(['Support', a.season, 'Cash', centsToDecimal(a.cashCents), a.cashReceivedOn, '', '']);
    for (const i of a.inKind)
      rows.push(['Support', a.season, `In-kind: ${i.description}`, centsToDecimal(i.valueCents), i.receivedOn, '', '']);
  }
  for (const c of r.credits)
    rows.push([
      'Credit',
      '',
      labelOf(DELIVERABLE_KIND_LABELS, c.kind),
      '',
      isoDateInZone(c.at, r.timeZone),
      c.postTitle ?? c.note ?? '',
      c.url,
    ]);
  const note = ['Note', '', notAReceipt(r.teamName), '', r.generatedOn, '', ''];
  return toCsv(
    ['Line', 'Season', 'Item', 'Declared value (CAD)', zonedHeader('Date', r.timeZone), 'Title or note', 'Link'],
    [...inDateOrder(rows, (row) => row[4] as string | null), note],
  );
}

/** The cash line the PDF prints; the portal shows the same figures (`cashReceivedCents`, `cashReceivedOn`). */
export function cashLine(a: Pick<AgreementView, 'cashCents' | 'cashReceivedCents' | 'cashReceivedOn'>): string {
  return `Cash received: ${formatCad(a.cashReceivedCents)} of ${formatCad(a.cashCents)}${a.cashReceivedOn ? ` (received ${a.cashReceivedOn})` : ' (not received yet)'}`;
}

/** The acknowledgement report as a PDF, in DejaVu Sans so every name prints as typed. */
export function acknowledgementPdf(r: ReportData): Promise<Buffer> {
  const { doc, done } = newPdf(`Sponsor acknowledgement — ${r.sponsor.name}`);

  doc.font('bold').fontSize(18).text('Sponsor acknowledgement');
  doc.font('body').fontSize(11).text(`${r.sponsor.name} · prepared by Padside for ${r.teamName} · ${r.generatedOn}`);
  doc.moveDown();
  doc.font('italic').fontSize(10).text(notAReceipt(r.teamName));
  doc.moveDown();
  for (const a of r.agreements) {
    doc.font('bold').fontSize(13).text(`Season ${a.season}`);
    doc.font('body').fontSize(10);
    if (a.cashCents) doc.text(cashLine(a));
    for (const i of a.inKind)
      doc.text(
        `In-kind: ${i.description}, declared value ${formatCad(i.valueCents)}${i.receivedOn ? ` (received ${i.receivedOn})` : ''}`,
      );
    doc.text(`Declared total: ${formatCad(a.totalCents)}`);
    for (const k of a.byKind)
      doc.text(`${labelOf(DELIVERABLE_KIND_LABELS, k.kind)}: ${k.delivered} of ${k.promised} delivered`);
    doc.moveDown(0.5);
  }
  doc.font('bold').fontSize(13).text('Credits delivered');
  doc.font('body').fontSize(10);
  if (!r.credits.length) doc.text('No credits yet.');
  for (const c of r.credits)
    doc.text(
      `${isoDateInZone(c.at, r.timeZone)} · ${labelOf(DELIVERABLE_KIND_LABELS, c.kind)} · ${c.postTitle ?? c.note ?? ''}${c.url ? ` · ${c.url}` : ''}`,
    );
  doc.end();
  return done;
}
