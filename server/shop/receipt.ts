import { formatDay } from '../../contracts/dates/club-dates';
import type { Receipt } from '../../contracts/shop/shop-answers';
import { formatRate, type Province } from './tax';

/**
 * What a buyer's receipt must carry for an input tax credit (Input Tax Credit Information (GST/HST) Regulations,
 * amended 2021, from memory): under C$100 the seller's name, the date and the total; from C$100 also the GST/HST
 * registration number and each tax with its rate; from C$500 also the buyer's name, the terms of payment and a
 * description of each supply. Padside prints everything it has at every size; the thresholds decide the rest.
 */
export const RECEIPT_THRESHOLDS = { registrationFromCents: 10_000, buyerFromCents: 50_000 } as const;

/** The seller as the shop settings describe it. */
export interface SellerDetails {
  name: string;
  gstHstNumber: string;
  /** Provincial sales tax account numbers by province, where the seller is registered. */
  provincialTaxNumbers: Partial<Record<Province, string>>;
}

/** The order facts a receipt is made from. */
export interface ReceiptInput {
  /** The day paid, in the club's time zone. */
  date: string;
  totalCents: number;
  taxes: { code: string; jurisdiction: string; ratePercent: string; amountCents: number }[];
  buyerName: string;
  items: { description: string; quantity: number; lineCents: number }[];
  paymentTerms: string;
}

const FEDERAL = ['GST', 'HST'];

/** The receipt for one paid order. */
export function receiptFor(input: ReceiptInput, seller: SellerDetails): Receipt {
  const large = input.totalCents >= RECEIPT_THRESHOLDS.buyerFromCents;
  const taxes = input.taxes.map((t) => ({
    code: t.code,
    jurisdiction: t.jurisdiction,
    label: `${t.code} ${formatRate(t.ratePercent)}%`,
    ratePercent: formatRate(t.ratePercent),
    amountCents: t.amountCents,
  }));
  const chargedFederal = input.taxes.some((t) => FEDERAL.includes(t.code));
  const provincial = input.taxes.filter((t) => !FEDERAL.includes(t.code));
  const gstHstNumber = chargedFederal && seller.gstHstNumber.trim() ? seller.gstHstNumber.trim() : null;
  const provincialTaxNumbers = provincial.flatMap((t) => {
    const number = seller.provincialTaxNumbers[t.jurisdiction as Province]?.trim();
    return number ? [{ code: t.code, jurisdiction: t.jurisdiction, number }] : [];
  });
  const missing: string[] = [];
  if (!seller.name.trim()) missing.push('sellerName');
  if (chargedFederal && !gstHstNumber && input.totalCents >= RECEIPT_THRESHOLDS.registrationFromCents)
    missing.push('gstHstNumber');
  return {
    sellerName: seller.name.trim(),
    date: input.date,
    totalCents: input.totalCents,
    taxes,
    gstHstNumber,
    provincialTaxNumbers,
    items: input.items,
    buyerName: large ? input.buyerName : null,
    paymentTerms: large ? input.paymentTerms : null,
    missing,
  };
}

/** The receipt as plain-text lines for the confirmation e-mail. */
export function receiptText(r: Receipt): string[] {
  return [
    `Seller: ${r.sellerName}`,
    `Date: ${formatDay(r.date)}`,
    ...(r.buyerName ? [`Sold to: ${r.buyerName}`] : []),
    ...(r.gstHstNumber ? [`GST/HST registration number: ${r.gstHstNumber}`] : []),
    ...r.provincialTaxNumbers.map((p) => `${p.code} number (${p.jurisdiction}): ${p.number}`),
    ...(r.paymentTerms ? [`Terms: ${r.paymentTerms}`] : []),
  ];
}
