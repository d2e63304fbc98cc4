import type { QuoteRequest } from '../../contracts/shop/shop-schemas';
import type { Quote } from '../../contracts/shop/shop-answers';
import { shippingFor } from '../../contracts/shop/shipping-price';
import type { Config } from '../config';
import { AppError, badRequest, conflict, type FieldErrors } from '../platform/app-error';
import { dateInZone } from '../platform/clock';
import type { Role } from '../platform/roles';
import type { SettingsService } from '../settings/settings-service';
import type { CatalogueRepository, ProductBundle } from './catalogue-repository';
import { percentOf } from './pricing';
import type { PricedLine, PricedQuote } from './priced-quote';
import { productView, variantRemaining } from './product-view';
import type { ShippingMethodRow, ShopConfigRepository } from './shop-config-repository';
import { postalCodeFitsProvince, postalLettersOf } from './postal-code';
import { SHOP_SETTINGS } from './shop-settings';
import { computeTaxes, PROVINCES, type Province } from './tax';

const CA_POSTAL = /^[ABCEGHJ-NPRSTVXY]\d[ABCEGHJ-NPRSTV-Z] ?\d[ABCEGHJ-NPRSTV-Z]\d$/i;
const US_ZIP = /^\d{5}(-\d{4})?$/;

/** Prices a cart: availability, member discount, shipping by weight, Canadian tax by place of supply. */
export class QuoteService {
  constructor(
    private readonly catalogue: CatalogueRepository,
    private readonly config: ShopConfigRepository,
    private readonly settings: SettingsService,
    private readonly appConfig: Config,
  ) {}

  /** Prices a cart as the server will charge it: per-order limits, member discount, shipping and each tax, so the buyer sees the real total before paying. */
  async quote(req: QuoteRequest, roles: Role[], now: Date): Promise<PricedQuote> {
    const wanted = new Map<number, number>();
    for (const i of req.items) wanted.set(i.variantId, (wanted.get(i.variantId) ?? 0) + i.quantity);
    const bundles = await this.catalogue.bundlesForVariants([...wanted.keys()]);
    const lines: PricedLine[] = [];
    const problems: FieldErrors = {};
    const overLimit: FieldErrors = {};
    let soldOut = false;
    let weight = 0;
    for (const [variantId, quantity] of wanted) {
      const field = `items.${req.items.findIndex((i) => i.variantId === variantId)}`;
      const b = bundles.find((x) => x.variants.some((v) => v.id === variantId));
      if (!b || !b.product.active) {
        problems[`${field}.variantId`] = 'This item is no longer sold.';
        continue;
      }
      const view = productView(b, now);
      const v = view.variants.find((x) => x.id === variantId)!;
      const ofProduct = req.items
        .filter((i) => b.variants.some((x) => x.id === i.variantId))
        .reduce((s, i) => s + i.quantity, 0);
      if (ofProduct > b.product.max_per_order) {
        overLimit[`${field}.quantity`] = `At most ${b.product.max_per_order} of ${b.product.name} per order.`;
        continue;
      }
      if (b.run && view.run?.state !== 'open') {
        soldOut ||= view.run?.state === 'sold_out';
        problems[`${field}.quantity`] = runClosedMessage(view.run?.state);
        continue;
      }
      const left = variantRemaining(b, variantId);
      if (quantity > left) {
        soldOut = true;
        problems[`${field}.quantity`] =
          left === 0
            ? `${b.product.name} (${v.label}) is sold out.`
            : `Only ${left} of ${b.product.name} (${v.label}) left.`;
        continue;
      }
      weight += v.weightGrams * quantity;
      lines.push(line(b, variantId, quantity, v.priceCents));
    }
    if (Object.keys(overLimit).length) throw badRequest('Part of the cart is over the per-order limit.', overLimit);
    if (Object.keys(problems).length) {
      throw soldOut
        ? conflict('sold_out', 'Part of the cart is sold out.', problems)
        : conflict('not_available', 'Part of the cart cannot be ordered now.', problems);
    }

    const shop = await this.settings.get(SHOP_SETTINGS);
    const method = await this.config.shippingMethod(req.shippingMethodId);
    if (!method || !method.active)
      throw badRequest('Choose a shipping method.', {
        shippingMethodId: 'Choose one of the shipping methods offered.',
      });
    const province = this.placeOfSupply(req.shipTo, method, shop.sellerProvince);
    const shippingCents = shippingFor(weight, method.brackets);
    if (shippingCents === null)
      throw badRequest('This order is too heavy for that shipping method.', {
        shippingMethodId: 'Too heavy for this method; choose another or split the order.',
      });

    const subtotalCents = lines.reduce((s, l) => s + l.lineCents, 0);
    const discountPercent = roles.includes('member') ? shop.memberDiscountPercent : 0;
    const discountCents = percentOf(subtotalCents, discountPercent);
    const pricedOn = dateInZone(now, this.appConfig.clubTimeZone);
    const taxLines = computeTaxes(
      { goodsCents: subtotalCents - discountCents, shippingCents, province, date: pricedOn },
      await this.config.taxRates(),
      {
        gstHstRegistered: shop.gstHstRegistered,
        provincialRegistrations: shop.provincialRegistrations,
        provincialTaxOnShipping: shop.provincialTaxOnShipping,
      },
    );
    const taxCents = taxLines.reduce((s, t) => s + t.amountCents, 0);
    return {
      lines,
      weightGrams: weight,
      shippingMethod: method,
      province,
      pricedOn,
      discountPercent,
      subtotalCents,
      discountCents,
      shippingCents,
      taxLines,
      taxCents,
      totalCents: subtotalCents - discountCents + shippingCents + taxCents,
    };
  }

  /** The province whose tax applies, checking the address against the method on the way. */
  private placeOfSupply(to: QuoteRequest['shipTo'], method: ShippingMethodRow, seller: Province): Province | null {
    if (method.code === 'pickup') return seller;
    const f: FieldErrors = {};
    if (!to.line1) f['shipTo.line1'] = 'Address is required.';
    if (!to.city) f['shipTo.city'] = 'City is required.';
    if (method.code === 'canada' && to.country !== 'CA') f.shippingMethodId = 'This method ships within Canada only.';
    if (method.code === 'usa' && to.country !== 'US') f.shippingMethodId = 'This method ships to the USA only.';
    if (method.code === 'international' && (to.country === 'CA' || to.country === 'US'))
      f.shippingMethodId = 'Choose the Canada or USA method for this address.';
    const province = to.province.toUpperCase();
    if (to.country === 'CA') {
      if (!(PROVINCES as readonly string[]).includes(province))
        f['shipTo.province'] = 'Choose a province or territory.';
      if (!CA_POSTAL.test(to.postalCode)) f['shipTo.postalCode'] = 'Enter a Canadian postal code such as R0K 1A0.';
      else if (!f['shipTo.province'] && !postalCodeFitsProvince(to.postalCode, province as Province)) {
        f['shipTo.postalCode'] =
          `This postal code is not in ${province}: codes there start with ${postalLettersOf(province as Province).join(', ')}. Check the code and the province.`;
      }
    }
    if (to.country === 'US' && !US_ZIP.test(to.postalCode)) f['shipTo.postalCode'] = 'Enter a ZIP code such as 58501.';
    if (Object.keys(f).length) throw new AppError(400, 'validation_failed', 'Some fields need attention.', f);
    return to.country === 'CA' ? (province as Province) : null;
  }
}

function line(b: ProductBundle, variantId: number, quantity: number, unitPriceCents: number): PricedLine {
  const v = b.variants.find((x) => x.id === variantId)!;
  return {
    variantId,
    runId: b.run?.id ?? null,
    productName: b.product.name,
    variantLabel: v.label,
    sku: v.sku,
    unitPriceCents,
    quantity,
    lineCents: unitPriceCents * quantity,
  };
}

function runClosedMessage(state: string | undefined): string {
  if (state === 'scheduled') return 'Orders for this run have not opened yet.';
  if (state === 'sold_out') return 'This run is sold out.';
  return 'Orders for this run have closed.';
}

/** The quote as the API answers it. */
export function quoteJson(q: PricedQuote): Quote {
  return {
    lines: q.lines.map((l) => ({
      variantId: l.variantId,
      productName: l.productName,
      variantLabel: l.variantLabel,
      sku: l.sku,
      unitPriceCents: l.unitPriceCents,
      quantity: l.quantity,
      lineCents: l.lineCents,
    })),
    weightGrams: q.weightGrams,
    shippingMethod: { id: q.shippingMethod.id, code: q.shippingMethod.code, name: q.shippingMethod.name },
    discountPercent: q.discountPercent,
    subtotalCents: q.subtotalCents,
    discountCents: q.discountCents,
    shippingCents: q.shippingCents,
    taxLines: q.taxLines.map((t) => ({
      code: t.code,
      label: t.label,
      ratePercent: t.ratePercent,
      amountCents: t.amountCents,
    })),
    taxCents: q.taxCents,
    totalCents: q.totalCents,
    currency: 'CAD',
  };
}
