import type { RouteAccess } from './access-types';
import { foundationAccess } from './foundation';

/** Every route the app serves, by feature. A route missing here fails the access test. */
export const ACCESS_TABLE: RouteAccess[] = [...foundationAccess];
