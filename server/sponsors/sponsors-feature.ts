import type { Feature, Platform } from '../feature';
import { ShopConfigRepository } from '../shop/shop-config-repository';
import { CreditService } from './credit-service';
import { sponsorPersonalData } from './sponsor-personal-data';
import { SponsorRepository } from './sponsor-repository';
import { sponsorAdminRoutes, sponsorPortalRoutes, sponsorPublicRoutes } from './sponsor-routes';
import { SponsorService } from './sponsor-service';
import { sponsorTaxRoutes } from './sponsor-tax-routes';
import { SponsorTaxService } from './sponsor-tax-service';

/** What the sponsors feature lends the build logs: publishing a post delivers the credits it names. */
export interface SponsorCredits {
  sponsors: SponsorRepository;
  credits: CreditService;
}

/** The sponsor ledger, its portal and the sponsorship tax; the build logs credit sponsors through `credits`. */
export function sponsorsFeature(platform: Platform): Feature & { credits: SponsorCredits } {
  const { db, clock, calendar, config } = platform.deps;
  const sponsorRepo = new SponsorRepository(db);
  const credits = new CreditService(sponsorRepo, config.publicUrl, config.site.teamName);
  // The sponsorship tax reads the rate table where the shop keeps it.
  const sponsorTax = new SponsorTaxService(
    db,
    sponsorRepo,
    platform.settings,
    new ShopConfigRepository(db),
    config.site.teamName,
  );
  const sponsors = new SponsorService(
    db,
    sponsorRepo,
    credits,
    platform.auth.users,
    platform.settings,
    sponsorTax,
    (urls) => platform.images.describe(urls),
  );
  const today = () => calendar.today();
  return {
    name: 'sponsors',
    credits: { sponsors: sponsorRepo, credits },
    mount(api) {
      api('/sponsors', sponsorPublicRoutes(sponsors, today));
      api('/admin/sponsors', sponsorTaxRoutes(sponsorTax, today));
      api('/admin/sponsors', sponsorAdminRoutes(sponsors, clock, today));
      api('/sponsor-portal', sponsorPortalRoutes(sponsors, today, config.site.teamName, config.clubTimeZone));
    },
    dashboard: {
      sponsorValue: () => sponsors.seasonValue(today()),
      overdueDeliverables: async () =>
        (await sponsors.overdue(today())).map((o) => ({
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
