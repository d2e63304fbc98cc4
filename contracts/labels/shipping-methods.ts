/** Where a shipping method delivers (the `shop_shipping_methods.code` codes); staff name each method themselves. */
export type ShippingMethodCode = 'pickup' | 'canada' | 'usa' | 'international';

export const SHIPPING_METHOD_LABELS: Readonly<Record<ShippingMethodCode, string>> = {
  pickup: 'Pick-up at a club launch',
  canada: 'Within Canada',
  usa: 'To the United States',
  international: 'Everywhere else',
};
