import type { Router } from 'express';
import type { AuthService } from './auth/auth-service';
import type { DashboardSources } from './books/dashboard-sources';
import type { AppDeps } from './deps';
import type { ScheduledJob } from './jobs/job-runner';
import type { SettingsService } from './settings/settings-service';
import type { ImageUploads } from './uploads/image-uploads';
import type { DatabaseNotifications } from './platform/database-notifications';
import type { PersonalDataPart } from './platform/personal-data';

/** What every feature is built from: the side-effecting deps plus the services all features share. */
export interface Platform {
  deps: AppDeps;
  auth: AuthService;
  settings: SettingsService;
  images: ImageUploads;
  /** This process's LISTEN connection, for in-memory copies that commits elsewhere must drop. */
  notifications: DatabaseNotifications;
}

/**
 * Mounts a flat router (routes only, no nested routers) at a path. Every mount is recorded so the access test
 * can list every route the app serves.
 */
export type Mount = (path: string, router: Router) => void;

/** A feature plugs its routers in under /api and may bring scheduled jobs; `site` routes sit outside /api (feeds). */
export interface Feature {
  name: string;
  mount(api: Mount): void;
  /** Routes under /api that are the same for every visitor: mounted before the session, which they never read. */
  mountPublic?(api: Mount): void;
  mountSite?(site: Mount): void;
  jobs?: ScheduledJob[];
  /** The numbers this feature gives the staff dashboard. */
  dashboard?: Partial<DashboardSources>;
  /** Records the processor's refunds of a charge this feature made, if it made it (true); the payment webhook calls it. */
  chargeRefunds?: (chargeId: string) => Promise<boolean>;
  /** What of this feature still shows one of these uploaded images ("the build log “Fin can”"), so it is kept. */
  imageUses?(urls: readonly string[]): Promise<string[]>;
  /** What this feature holds about one person: its part of the download and of an account's deletion. */
  personalData?: PersonalDataPart;
}
