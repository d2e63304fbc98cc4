import type { Feature, Platform } from '../feature';
import { AnnouncementAudience } from './announcement-audience';
import { announcementsPersonalData } from './announcements-personal-data';
import { AnnouncementRepository } from './announcement-repository';
import { accountSubscriptionRoutes, announcementAdminRoutes, subscriptionRoutes } from './announcement-routes';
import { AnnouncementService } from './announcement-service';
import { commercialMailer } from './commercial-mailer';
import { SubscriptionRepository } from './subscription-repository';
import { SubscriptionService } from './subscription-service';
import { UnsubscribeTokens } from './unsubscribe-token';

/** Announcements people asked for: sign-ups with double opt-in and consent records, one-click unsubscribe, sends. */
export function announcementsFeature(platform: Platform): Feature {
  const { db, clock, config } = platform.deps;
  const tokens = new UnsubscribeTokens(config.sessionSecret, config.publicUrl);
  const subscriptionRepo = new SubscriptionRepository(db);
  const subscriptions = new SubscriptionService(db, subscriptionRepo, tokens, platform.auth.afterAnswer, clock, {
    teamName: config.site.teamName,
    publicUrl: config.publicUrl,
  });
  const audience = new AnnouncementAudience(subscriptionRepo, {
    teamName: config.site.teamName,
    clubName: config.site.clubName,
    timeZone: config.clubTimeZone,
  });
  const mailer = commercialMailer(platform);
  const announcements = new AnnouncementService(
    db,
    new AnnouncementRepository(db),
    subscriptionRepo,
    audience,
    mailer,
    platform.settings,
    clock,
    {
      teamName: config.site.teamName,
      publicUrl: config.publicUrl,
      timeZone: config.clubTimeZone,
    },
  );
  return {
    name: 'announcements',
    mount(api) {
      api('/subscriptions', subscriptionRoutes(subscriptions));
      api('/account/subscriptions', accountSubscriptionRoutes(subscriptions));
      api('/admin/announcements', announcementAdminRoutes(announcements));
    },
    jobs: [
      { name: 'drop-notices', cron: '*/5 * * * *', run: () => announcements.sendDropNotices() },
      { name: 'implied-consents', cron: '30 3 * * *', run: () => announcements.recordImpliedConsents() },
    ],
    personalData: announcementsPersonalData,
  };
}
