import { centsToDecimal, toCsv } from '../platform/csv';
import { formatCad } from '../platform/money';
import { newPdf } from '../platform/pdf-document';
import type { AgreementView, CreditView, SponsorView } from './sponsor-views';

/** What the report says about itself, in Padside's words; the PDF and the CSV carry the same sentence. */
const notAReceipt = (teamName: string) =>
  `This report acknowledges the support listed below and the credits ${teamName} delivered in return. It is not an official donation receipt for income tax purposes: ` +
  'in Canada only registered charities and other qualified donees issue those. For how sponsorship is treated for tax, ask the Canada Revenue Agency or your accountant.';

const KIND_LABELS: Record<string, string> = {
  build_log_credit: 'Build log credit',
  video_mention: 'Video mention',
  logo_on_merch: 'Logo on merch',
  sponsors_page: 'Sponsors page listing',
  social_post: 'Social post',
};


export interface ReportData {
  sponsor: SponsorView;
  agreements: AgreementView[];
  credits: CreditView[];
  generatedOn: string;
  teamName: string;
}

/** The acknowledgement report as CSV: one row per support item and one per credit. */
export function acknowledgementCsv(r: ReportData): string {
  const rows: (string | number | null)[][] = [];
  for (const a of r.agreements) {
    if (a.cashCents) rows.push(['support', a.season, 'Cash', centsToDecimal(a.cashCents), a.cashReceivedOn, '', '']);
    for (const i of a.inKind) rows.push(['support', a.season, `In-kind: ${i.description}`, centsToDecimal(i.valueCents), i.receivedOn, '', '']);
  }
  for (const c of r.credits) rows.push(['credit', '', KIND_LABELS[c.kind] ?? c.kind, '', c.at.slice(0, 10), c.postTitle ?? c.note ?? '', c.url]);
  rows.push(['note', '', notAReceipt(r.teamName), '', r.generatedOn, '', '']);
  return toCsv(['line', 'season', 'item', 'declared_value_cad', 'date', 'title_or_note', 'link'], rows);
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
    for (const i of a.inKind) doc.text(`In-kind: ${i.description}, declared value ${formatCad(i.valueCents)}${i.receivedOn ? ` (received ${i.receivedOn})` : ''}`);
    doc.text(`Declared total: ${formatCad(a.totalCents)}`);
    for (const k of a.byKind) doc.text(`${KIND_LABELS[k.kind]}: ${k.delivered} of ${k.promised} delivered`);
    doc.moveDown(0.5);
  }
  doc.font('bold').fontSize(13).text('Credits delivered');
  doc.font('body').fontSize(10);
  if (!r.credits.length) doc.text('No credits yet.');
  for (const c of r.credits) doc.text(`${c.at.slice(0, 10)} · ${KIND_LABELS[c.kind] ?? c.kind} · ${c.postTitle ?? c.note ?? ''}${c.url ? ` · ${c.url}` : ''}`);
  doc.end();
  return done;
}
