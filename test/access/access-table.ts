import type { RouteAccess } from './access-types';
import { announcementsAccess } from './announcements';
import { booksAccess } from './books';
import { buildLogsAccess } from './build-logs';
import { foundationAccess } from './foundation';
import { launchesAccess } from './launches';
import { sponsorsAccess } from './sponsors';
import { membershipAccess } from './membership';
import { shopAccess } from './shop';

/** Every route the app serves, by feature. A route missing here fails the access test. */
export const ACCESS_TABLE: RouteAccess[] = [
  ...foundationAccess,
  ...buildLogsAccess,
  ...sponsorsAccess,
  ...membershipAccess,
  ...shopAccess,
  ...booksAccess,
  ...launchesAccess,
  ...announcementsAccess,
];
