import { dateInZone } from '../platform/clock';
import type { SettingsService } from '../settings/settings-service';
import type { OrderBundle } from './order-rows';
import type { Receipt } from '../../contracts/shop/shop-answers';
import { receiptFor, type SellerDetails } from './receipt';
import { SHOP_SETTINGS } from './shop-settings';

/** Builds a paid order's receipt from the seller details in the shop settings. */
export class ReceiptService {
  constructor(
    private readonly settings: SettingsService,
    private readonly teamName: string,
    private readonly timeZone: string,
  ) {}

  /** The seller's name (the team's name until a legal or trading name is set) and registration numbers. */
  async seller(): Promise<SellerDetails> {
    const s = await this.settings.get(SHOP_SETTINGS);
    return {
      name: s.sellerName.trim() || this.teamName,
      gstHstNumber: s.gstHstNumber,
      provincialTaxNumbers: s.provincialTaxNumbers,
    };
  }

  /** The receipt, or null while the order is unpaid. */
  async forOrder(b: OrderBundle): Promise<Receipt | null> {
    return b.order.paid_at ? this.build(b, await this.seller()) : null;
  }

  /** The receipt of a paid order, with seller details already read (inside a transaction, say). */
  build(b: OrderBundle, seller: SellerDetails): Receipt {
    const o = b.order;
    return receiptFor(
      {
        date: dateInZone(o.paid_at ?? o.created_at, this.timeZone),
        totalCents: o.total_cents,
        taxes: b.taxes.map((t) => ({
          code: t.code,
          jurisdiction: t.jurisdiction,
          ratePercent: t.rate_percent,
          amountCents: t.amount_cents,
        })),
        buyerName: o.ship_name,
        items: b.items.map((i) => ({
          description: `${i.product_name} (${i.variant_label}), SKU ${i.sku}`,
          quantity: i.quantity,
          lineCents: i.unit_price_cents * i.quantity,
        })),
        paymentTerms: o.paid_outside_processor ? 'Paid in full' : 'Paid in full by card',
      },
      seller,
    );
  }
}
