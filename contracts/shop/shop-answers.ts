/** What the storefront and order routes answer: the server types its views with these; the app reads them. */
import type { OrderStatus } from '../labels/order-statuses';
import type { RunState } from '../labels/run-states';
import type { ShippingMethodCode } from '../labels/shipping-methods';
import type { WeightBracket } from './shipping-price';

/** A product's current print run as the storefront shows it (its state already moved by the window). */
export interface RunSummary {
  id: number;
  name: string;
  state: RunState;
  cap: number;
  remaining: number;
  opensAt: string;
  closesAt: string;
}

/** A product photo: the full image, its 480 px WebP copy, the words for a screen reader and the full size. */
export interface ProductImage {
  url: string;
  thumbnailUrl: string;
  alt: string;
  /** The full image's size in pixels, so pages reserve its space before it loads. */
  width?: number;
  height?: number;
}

export interface SizeChart {
  columns: string[];
  rows: string[][];
}

/** One size or colour of a product, priced and weighed (the product's own figures where it has none). */
export interface Variant {
  id: number;
  sku: string;
  label: string;
  priceCents: number;
  weightGrams: number;
  remaining: number;
}

/** GET /api/products: a product as the storefront lists it. */
export interface Product {
  id: number;
  slug: string;
  name: string;
  priceCents: number;
  currency: 'CAD';
  weightGrams: number;
  /** Units of this product one order may hold. */
  maxPerOrder: number;
  images: ProductImage[];
  sizeChart: SizeChart | null;
  orderable: boolean;
  run: RunSummary | null;
  variants: Variant[];
}

/** GET /api/products/:slug: the product with its description rendered. */
export interface ProductDetail extends Product {
  descriptionHtml: string;
}

/** GET /api/shipping-methods. */
export interface ShippingMethod {
  id: number;
  code: ShippingMethodCode;
  name: string;
  brackets: WeightBracket[];
}

/** One tax on a quote or an order, with its printed label ("HST 13%"). */
export interface TaxLine {
  code: string;
  label: string;
  ratePercent: string;
  amountCents: number;
}

/** Where an order goes, as the checkout form holds it; empty strings for what a pickup does not need. */
export interface ShipTo {
  name: string;
  line1: string;
  line2: string;
  city: string;
  province: string;
  postalCode: string;
  country: string;
}

/** Where an order went, as stored: the lines a pickup did not need are null. */
export type StoredShipTo = Pick<ShipTo, 'name' | 'country'> & {
  [K in 'line1' | 'line2' | 'city' | 'province' | 'postalCode']: string | null;
};

/** One priced line of a quote. */
export interface QuoteLine {
  variantId: number;
  productName: string;
  variantLabel: string;
  sku: string;
  unitPriceCents: number;
  quantity: number;
  lineCents: number;
}

/** The figures a quote and an order both carry, computed by the server (integer cents). */
export interface OrderFigures {
  discountPercent: number;
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  taxLines: TaxLine[];
  taxCents: number;
  totalCents: number;
  currency: 'CAD';
}

/** POST /api/checkout/quote: every figure of the order, computed by the server. */
export interface Quote extends OrderFigures {
  lines: QuoteLine[];
  weightGrams: number;
  shippingMethod: { id: number; code: ShippingMethodCode; name: string };
}

/** One line of an order as it was sold. */
export interface OrderItem extends QuoteLine {
  id: number;
  runId: number | null;
  restockedQuantity: number;
}

/** What a receipt for input tax credits carries; fields not required at its size are null and not printed. */
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
  /** What the receipt should carry at this size but the settings lack (for staff). */
  missing: string[];
}

/** An order as its buyer sees it (staff get more, see StaffOrder). */
export interface Order extends OrderFigures {
  id: number;
  number: string;
  status: OrderStatus;
  email: string;
  createdAt: string;
  paidAt: string | null;
  packedAt: string | null;
  shippedAt: string | null;
  shipTo: StoredShipTo;
  shippingMethod: { code: string; name: string };
  carrier: string | null;
  trackingNumber: string | null;
  items: OrderItem[];
  refundedCents: number;
  paymentMessage: string | null;
  /** What happens next, in plain words (the buyer's own order view only). */
  nextSteps?: string[];
  /** The receipt; null until paid. */
  receipt?: Receipt | null;
}

/** POST /api/orders and /api/orders/:id/pay: the order, and the processor's words while a payment is pending. */
export interface OrderAnswer {
  order: Order;
  message?: string;
}

/** One row of the buyer's own orders. */
export interface OrderSummary {
  id: number;
  number: string;
  status: OrderStatus;
  createdAt: string;
  totalCents: number;
  refundedCents: number;
  shippingName: string;
  carrier: string | null;
  trackingNumber: string | null;
}

/** GET /api/account/orders: the buyer's orders and where the latest mailed one went (offered again at checkout). */
export interface AccountOrders {
  items: OrderSummary[];
  lastShipTo: ShipTo | null;
}

/** GET /api/payments/card-entry: labelled test tokens against the local fake, or Stripe.js with a publishable key. */
export type CardEntry = { mode: 'test-cards'; publishableKey: null } | { mode: 'stripe-js'; publishableKey: string };
