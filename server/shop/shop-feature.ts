import { PaymentThrottle } from '../payments/payment-throttle';
import type { Feature, Platform } from '../feature';
import { NotifiedCache, type ReadyJson } from '../platform/notified-cache';
import { BuyerOrderService } from './buyer-order-service';
import { CatalogueRepository } from './catalogue-repository';
import { CatalogueService } from './catalogue-service';
import { RunAdminService } from './run-admin-service';
import { shopPersonalData } from './shop-personal-data';
import { CheckoutService } from './checkout-service';
import { FulfilmentService } from './fulfilment-service';
import { OrderGuide } from './order-guide';
import { OrderLinks } from './order-links';
import { OrderRepository } from './order-repository';
import { OrderTableRepository } from './order-table-repository';
import { StockRepository } from './stock-repository';
import { paymentRoutes } from './payment-routes';
import { QuoteService } from './quote-service';
import { ReceiptService } from './receipt-service';
import { RefundRepository } from './refund-repository';
import { RefundService } from './refund-service';
import { shopDashboard } from './shop-dashboard';
import { orderAdminRoutes, productAdminRoutes, runAdminRoutes, shopSettingsRoutes } from './shop-admin-routes';
import { ShopConfigRepository } from './shop-config-repository';
import { ShopConfigService } from './shop-config-service';
import { accountOrderRoutes, checkoutRoutes, orderRoutes, productRoutes, shippingMethodRoutes } from './shop-routes';
import { StaffOrderService } from './staff-order-service';
import { PaymentEventRepository } from './payment-event-repository';
import { WebhookService } from './webhook-service';

/**
 * The merch shop: catalogue, checkout, fulfilment, refunds, the payment webhook and reconciliation. `otherCharges`
 * records processor refunds of charges other features made (dues), for the webhook and the refund reconciliation.
 */
export function shopFeature(
  platform: Platform,
  otherCharges: (chargeId: string) => Promise<boolean> = async () => false,
): Feature {
  const { deps, settings } = platform;
  const catalogueRepo = new CatalogueRepository(deps.db);
  const config = new ShopConfigRepository(deps.db);
  const orders = new OrderRepository(deps.db);
  const stock = new StockRepository();
  const quotes = new QuoteService(catalogueRepo, config, settings, deps.config);
  const catalogue = new CatalogueService(
    deps.db,
    catalogueRepo,
    deps.clock,
    new NotifiedCache<ReadyJson>(platform.notifications, 'shop_catalogue'),
  );
  const links = new OrderLinks(deps.config.sessionSecret, deps.config.publicUrl);
  const guide = new OrderGuide(orders, deps.clock, deps.config.site.clubName, deps.config.clubTimeZone);
  const receipts = new ReceiptService(settings, deps.config.site.teamName, deps.config.clubTimeZone);
  const checkout = new CheckoutService(
    deps.db,
    orders,
    stock,
    quotes,
    deps.payments,
    settings,
    deps.clock,
    links,
    deps.config.site.teamName,
    deps.log,
    receipts,
    guide,
  );
  const fulfilment = new FulfilmentService(deps.db, orders, deps.clock, links, deps.config.site.teamName);
  const refundRepo = new RefundRepository(deps.db);
  const refunds = new RefundService(
    deps.db,
    orders,
    stock,
    refundRepo,
    deps.payments,
    deps.clock,
    deps.log,
    deps.config.site.teamName,
  );
  const webhooks = new WebhookService(
    deps.db,
    { gateway: deps.payments, secret: deps.config.stripe.webhookSecret },
    new PaymentEventRepository(deps.db),
    orders,
    refunds,
    settings,
    deps.clock,
    otherCharges,
  );
  const shopConfig = new ShopConfigService(deps.db, config);
  const pub = {
    catalogue,
    quotes,
    checkout,
    orders: new BuyerOrderService(orders, receipts, links, guide),
    config: shopConfig,
    throttle: new PaymentThrottle(deps.db),
    now: () => deps.clock.now(),
  };
  const admin = {
    catalogue,
    runs: new RunAdminService(deps.db, catalogueRepo, settings, deps.clock),
    fulfilment,
    refunds,
    orders: new StaffOrderService(orders, new OrderTableRepository(deps.db), refundRepo, deps.config.clubTimeZone),
    config: shopConfig,
    settings,
    timeZone: deps.config.clubTimeZone,
  };
  return {
    name: 'shop',
    mountPublic(api) {
      api('/products', productRoutes(pub));
    },
    mount(api) {
      api('/shipping-methods', shippingMethodRoutes(pub));
      api('/checkout', checkoutRoutes(pub));
      api('/orders', orderRoutes(pub));
      api('/account/orders', accountOrderRoutes(pub));
      api('/admin/orders', orderAdminRoutes(admin));
      api('/admin/products', productAdminRoutes(admin));
      api('/admin/runs', runAdminRoutes(admin));
      api('/admin/shop', shopSettingsRoutes(admin));
      api('/payments', paymentRoutes(deps.config.stripe, webhooks));
    },
    personalData: shopPersonalData,
    imageUses: async (urls) => (await catalogueRepo.namesUsingImage(urls)).map((n) => `the product “${n}”`),
    jobs: [
      { name: 'shop-reconcile-payments', cron: '*/5 * * * *', run: () => checkout.reconcile() },
      { name: 'reconcile-refunds', cron: '*/5 * * * *', run: () => refunds.reconcile(otherCharges) },
    ],
    dashboard: shopDashboard(deps.db, catalogueRepo, deps.clock, settings, deps.config.clubTimeZone),
  };
}
