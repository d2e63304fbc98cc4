import type { Feature, Platform } from '../feature';
import { CreditService } from '../sponsors/credit-service';
import { sponsorPersonalData } from '../sponsors/sponsor-personal-data';
import { SponsorRepository } from '../sponsors/sponsor-repository';
import { sponsorAdminRoutes, sponsorPortalRoutes, sponsorPublicRoutes } from '../sponsors/sponsor-routes';
import { SponsorService } from '../sponsors/sponsor-service';
import { sponsorTaxRoutes } from '../sponsors/sponsor-tax-routes';
import { SponsorTaxService } from '../sponsors/sponsor-tax-service';
import { ShopConfigRepository } from '../shop/shop-config-repository';
import { feedRoutes } from './feed-routes';
import { PostRepository } from './post-repository';
import { postAdminRoutes, postPublicRoutes } from './post-routes';
import { PostService } from './post-service';

/** Build logs and the sponsor acknowledgement ledger: one feature, because publishing a post delivers credits. */
export function buildLogsFeature(platform: Platform): Feature {
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
  const postRepo = new PostRepository(db);
  const posts = new PostService(db, postRepo, sponsorRepo, credits, (urls) => platform.images.describe(urls));
  return {
    name: 'build-logs',
    mount(api) {
      api('/posts', postPublicRoutes(posts));
      api('/admin/posts', postAdminRoutes(posts, clock));
      api('/sponsors', sponsorPublicRoutes(sponsors, today));
      api('/admin/sponsors', sponsorTaxRoutes(sponsorTax, today));
      api('/admin/sponsors', sponsorAdminRoutes(sponsors, clock, today));
      api('/sponsor-portal', sponsorPortalRoutes(sponsors, today, config.site.teamName, config.clubTimeZone));
    },
    mountSite(site) {
      site('/feeds', feedRoutes(posts, config.publicUrl, config.site.teamName));
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
    imageUses: async (urls) => [
      ...(await postRepo.titlesUsingImage(urls)).map((t) => `the build log “${t}”`),
      ...(await sponsorRepo.namesUsingLogo(urls)).map((n) => `the sponsor “${n}” (logo)`),
    ],
    personalData: sponsorPersonalData,
    jobs: [{ name: 'publish-scheduled-posts', cron: '* * * * *', run: () => posts.publishDue(clock.now()) }],
  };
}
