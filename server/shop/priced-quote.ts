/**
 * A quote as the server keeps it while placing an order: the answer's figures plus what only the order row needs
 * (run of each line, the method's row, the province taxed, the pricing day). Types only, so the order repository
 * can store one without importing the quote service.
 */
import type { Quote, QuoteLine } from '../../contracts/shop/shop-answers';
import type { ShippingMethodRow } from './shop-config-repository';
import type { Province, TaxLine } from './tax';

/** One priced line, with the run its units are held from. */
export interface PricedLine extends QuoteLine {
  runId: number | null;
}

/** Every figure of an order, computed by the server; the tax lines keep their jurisdiction and taxable base. */
export interface PricedQuote extends Omit<Quote, 'lines' | 'shippingMethod' | 'taxLines' | 'currency'> {
  lines: PricedLine[];
  shippingMethod: ShippingMethodRow;
  province: Province | null;
  pricedOn: string;
  taxLines: TaxLine[];
}
