import type { PostTitles } from '../build-logs/build-logs-feature';
import type { Feature, Platform } from '../feature';
import { ShopConfigRepository } from '../shop/shop-config-repository';
import { AgreementRepository } from './agreement-repository';
import { AgreementService } from './agreement-service';
import { CreditRepository } from './credit-repository';
import { CreditService } from './credit-service';
import { sponsorPersonalData } from './sponsor-personal-data';
import { SponsorRepository } from './sponsor-repository';
import { sponsorAdminRoutes, sponsorPortalRoutes, sponsorPublicRoutes } from './sponsor-routes';
import { SponsorService } from './sponsor-service';
import { sponsorTaxRoutes } from './sponsor-tax-routes';
import { SponsorTaxService } from './sponsor-tax-service';
import { SponsorTierService } from './sponsor-tier-service';

/** What the sponsors feature lends the build logs: publishing a post delivers the credits it names. */
export interface SponsorCredits {
  sponsors: SponsorRepository;
  credits: CreditService;
}

/**
 * The sponsor ledger, its portal and the sponsorship tax; the build logs credit sponsors through `credits`, and lend
 * the crediting posts' titles through `posts`.
 */
export function sponsorsFeature(platform: Platform, posts: PostTitles): Feature & { credits: SponsorCredits } {
  const { db, clock, calendar, config } = platform.deps;
  const sponsorRepo = new SponsorRepository(db);
  const agreementRepo = new AgreementRepository(db);
  const creditRepo = new CreditRepository(db);
  const credits = new CreditService(creditRepo, sponsorRepo, agreementRepo, config.publicUrl, config.site.teamName);
  // The sponsorship tax reads the rate table where the shop keeps it.
  const sponsorTax = new SponsorTaxService(
    db,
    sponsorRepo,
    agreementRepo,
    platform.settings,
    new ShopConfigRepository(db),
    config.site.teamName,
  );
  const tiers = new SponsorTierService(sponsorRepo, agreementRepo, platform.settings, posts, (urls) =>
    platform.images.describe(urls),
  );
  const agreements = new AgreementService(db, sponsorRepo, agreementRepo, sponsorTax, tiers);
  const sponsors = new SponsorService(db, sponsorRepo, creditRepo, credits, platform.auth.users, posts);
  const services = { sponsors, agreements, tiers };
  const today = () => calendar.today();
  return {
    name: 'sponsors',
    credits: { sponsors: sponsorRepo, credits },
    mount(api) {
      api('/sponsors', sponsorPublicRoutes(tiers, today));
      api('/admin/sponsors', sponsorTaxRoutes(sponsorTax, today));
      api('/admin/sponsors', sponsorAdminRoutes(services, clock, today));
      api('/sponsor-portal', sponsorPortalRoutes(services, today, config.site.teamName, config.clubTimeZone));
    },
    dashboard: {
      sponsorValue: () => agreements.seasonValue(today()),
      overdueDeliverables: async () =>
        (await agreements.overdue(today())).map((o) => ({
          sponsor: o.sponsorName,
          kind: o.kind,
          dueOn: o.dueOn,
          missing: o.promised - o.delivered,
        })),
    },
    imageUses: async (urls) => (await sponsorRepo.namesUsingLogo(urls)).map((n) => `the sponsor “${n}” (logo)`),
    personalData: sponsorPersonalData,
  };
}
