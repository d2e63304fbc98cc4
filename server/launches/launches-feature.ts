import { CheckInTokens } from '../membership/check-in-token';
import { MembershipRepository } from '../membership/membership-repository';
import type { Feature, Platform } from '../feature';
import { flightAdminRoutes, flightRoutes, logbookRoutes } from './flight-routes';
import { launchesPersonalData } from './launches-personal-data';
import { FlightRepository } from './flight-repository';
import { FlightService } from './flight-service';
import { FlyerStanding } from './flyer-standing';
import { launchAdminRoutes, launchFeedRoutes, launchRoutes } from './launch-routes';
import { LaunchRepository } from './launch-repository';
import { LaunchService } from './launch-service';

/** Launch days and flights: the club calendar and its feed, RSVPs, check-in, flight cards, the range queue, logs. */
export function launchesFeature(platform: Platform): Feature {
  const { db, clock, config } = platform.deps;
  const flyers = new FlyerStanding(
    new MembershipRepository(db),
    new CheckInTokens(config.sessionSecret),
    platform.settings,
    clock,
    config.clubTimeZone,
  );
  const launches = new LaunchService(db, new LaunchRepository(db), flyers, platform.settings, clock, {
    timeZone: config.clubTimeZone,
    publicUrl: config.publicUrl,
    clubName: config.site.clubName,
  });
  const flights = new FlightService(db, new FlightRepository(db), launches, flyers, platform.settings);
  return {
    name: 'launches',
    mount(api) {
      api('/launches', launchRoutes(launches, flights));
      api('/admin/launches', launchAdminRoutes(launches, flights));
      api('/flights', flightRoutes(flights));
      api('/admin/flights', flightAdminRoutes(flights));
      api('/account/flights', logbookRoutes(flights));
    },
    mountSite(site) {
      site('/feeds', launchFeedRoutes(launches));
    },
    dashboard: {
      launchSeason: async () => {
        const season = await launches.season();
        const totals = await flights.seasonTotals(`${season.season}-01-01`, `${season.season}-12-31`);
        return { ...season, ...totals };
      },
    },
    personalData: launchesPersonalData,
    jobs: [{ name: 'launch-reminders', cron: '0 9 * * *', run: () => launches.sendReminders() }],
  };
}
