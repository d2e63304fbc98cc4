import { ShopSettingsSchema, type ShopSettings } from '../../contracts/shop/shop-settings-schemas';
import { defineSetting } from '../settings/settings-service';

// The schema is the contract's; the settings routes parse with it from here.
export { ShopSettingsSchema };

/**
 * The shop's tax position, discount and printer rules. Defaults are the demo seller: Manitoba, registered for
 * GST/HST and Manitoba RST only, 10% member discount. Provincial tax on shipping: from memory (Manitoba RST and
 * Quebec QST on delivery charged by the seller; B.C. and Saskatchewan likewise): confirm with each province.
 * Spares 5%, packs of 6 and 12 pieces a design: common practice, no source. Seller name and registration numbers
 * start empty (receipts then name the team and print no number); the demo seed fills in invented ones. The carrier
 * starts empty: Padside names no shipping company.
 */
export const SHOP_SETTINGS = defineSetting<ShopSettings>('shop', ShopSettingsSchema, {
  sellerProvince: 'MB',
  sellerName: '',
  gstHstNumber: '',
  provincialTaxNumbers: {},
  gstHstRegistered: true,
  provincialRegistrations: ['MB'],
  provincialTaxOnShipping: { MB: true, QC: true, BC: true, SK: true },
  memberDiscountPercent: 10,
  sparesPercent: 5,
  packMultiple: 6,
  minimumPerDesign: 12,
  staffEmail: 'treasurer@padside.test',
  carrier: '',
});
