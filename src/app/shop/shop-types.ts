/** Shapes of the shop API, as the server sends them. */
export interface RunSummary {
  id: number;
  name: string;
  state: 'scheduled' | 'open' | 'sold_out' | 'closed' | 'in_production' | 'shipped';
  cap: number;
  remaining: number;
  opensAt: string;
  closesAt: string;
}
/** A product photo: the full image, its 480 px copy, the words for a screen reader and the full size. */
export interface ProductImage {
  url: string;
  thumbnailUrl: string;
  alt: string;
  width?: number;
  height?: number;
}
export interface Variant {
  id: number;
  sku: string;
  label: string;
  priceCents: number;
  weightGrams: number;
  remaining: number;
}
export interface Product {
  id: number;
  slug: string;
  name: string;
  priceCents: number;
  currency: 'CAD';
  /** Units of this product one order may hold. */
  maxPerOrder: number;
  images: ProductImage[];
  sizeChart: { columns: string[]; rows: string[][] } | null;
  orderable: boolean;
  run: RunSummary | null;
  variants: Variant[];
  descriptionHtml?: string;
}
export interface ShippingMethod {
  id: number;
  code: 'pickup' | 'canada' | 'usa' | 'international';
  name: string;
  brackets: { maxGrams: number | null; priceCents: number }[];
}
export interface TaxLine {
  code: string;
  label: string;
  ratePercent: string;
  amountCents: number;
}
export interface ShipTo {
  name: string;
  line1: string;
  line2: string;
  city: string;
  province: string;
  postalCode: string;
  country: string;
}
export interface QuoteRequest {
  items: { variantId: number; quantity: number }[];
  shipTo: ShipTo;
  shippingMethodId: number;
}
export interface Quote {
  lines: { variantId: number; productName: string; variantLabel: string; sku: string; unitPriceCents: number; quantity: number; lineCents: number }[];
  discountPercent: number;
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  taxLines: TaxLine[];
  taxCents: number;
  totalCents: number;
}
export interface Order {
  id: number;
  number: string;
  status: 'pending' | 'paid' | 'failed' | 'packed' | 'shipped';
  email: string;
  createdAt: string;
  paidAt: string | null;
  packedAt: string | null;
  shippedAt: string | null;
  shipTo: ShipTo;
  shippingMethod: { code: string; name: string };
  carrier: string | null;
  trackingNumber: string | null;
  items: { id: number; productName: string; variantLabel: string; sku: string; unitPriceCents: number; quantity: number; lineCents: number }[];
  discountPercent: number;
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  taxLines: TaxLine[];
  taxCents: number;
  totalCents: number;
  refundedCents: number;
  paymentMessage: string | null;
  /** What happens next, in plain words (the buyer's own order view only). */
  nextSteps?: string[];
  /** What a receipt for input tax credits carries; null until paid. */
  receipt?: Receipt | null;
}
/** The receipt block of a paid order (fields not needed at its size are null). */
export interface Receipt {
  sellerName: string;
  date: string;
  totalCents: number;
  taxes: { code: string; jurisdiction: string; label: string; ratePercent: string; amountCents: number }[];
  gstHstNumber: string | null;
  provincialTaxNumbers: { code: string; jurisdiction: string; number: string }[];
  items: { description: string; quantity: number; lineCents: number }[];
  buyerName: string | null;
  paymentTerms: string | null;
}
export interface OrderSummary {
  id: number;
  number: string;
  status: Order['status'];
  createdAt: string;
  totalCents: number;
  refundedCents: number;
  shippingName: string;
  carrier: string | null;
  trackingNumber: string | null;
}
/** What the buyer sees for each status (Padside's own words, shared with e-mails and CSVs). */
export { ORDER_STATUS_LABELS as STATUS_LABELS } from '@contracts/labels/order-statuses';
