import { AccountAdminService } from '../admin/account-admin-service';
import { AccountChangeRepository } from '../admin/account-change-repository';
import { userAdminRoutes } from '../admin/user-admin-routes';
import { authRoutes } from '../auth/auth-routes';
import type { Feature, Platform } from '../feature';
import type { PersonalDataPart } from '../platform/personal-data';
import { accountRoutes } from './account-routes';
import { PersonalDataService } from './personal-data-service';

/**
 * Signing in and out, a person's own account (with the download and deletion of everything Padside holds about
 * them, over every other feature's part) and the staff's accounts list.
 */
export function accountsFeature(platform: Platform, otherParts: PersonalDataPart[]): Feature {
  const { deps, auth } = platform;
  const personalData = new PersonalDataService(
    deps.db,
    auth.users,
    otherParts,
    deps.clock,
    deps.config.site.teamName,
    deps.log,
  );
  const accountAdmin = new AccountAdminService(
    deps.db,
    auth.users,
    new AccountChangeRepository(deps.db),
    auth.signInGuard,
  );
  return {
    name: 'accounts',
    mount(api) {
      api('/auth', authRoutes(auth));
      api(
        '/account',
        accountRoutes(auth, personalData, { siteName: deps.config.site.teamName, timeZone: deps.config.clubTimeZone }),
      );
      api('/admin/users', userAdminRoutes(accountAdmin));
    },
  };
}
