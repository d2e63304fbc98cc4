import { accountsFeature } from './account/accounts-feature';
import { announcementsFeature } from './announcements/announcements-feature';
import { membershipFeature } from './membership/membership-feature';
import { buildLogsFeature, postTitles } from './build-logs/build-logs-feature';
import { booksFeature } from './books/books-feature';
import { launchesFeature } from './launches/launches-feature';
import type { Feature, Platform } from './feature';
import { seoFeature } from './seo/seo-feature';
import { shopFeature } from './shop/shop-feature';
import { sponsorsFeature } from './sponsors/sponsors-feature';
import { uploadsFeature } from './uploads/uploads-feature';

/** Every feature of Padside, in mounting order. Add one line per feature. */
export function buildFeatures(platform: Platform): Feature[] {
  // Each lends the other a narrow reader: the build logs their posts' titles, the sponsors their credits.
  const sponsors = sponsorsFeature(platform, postTitles(platform.deps.db));
  const membership = membershipFeature(platform);
  // The shop receives the processor's events; refunds of other features' charges go to the feature that made them.
  const otherCharges = async (chargeId: string) => (await membership.chargeRefunds?.(chargeId)) ?? false;
  const features: Feature[] = [
    buildLogsFeature(platform, sponsors.credits),
    sponsors,
    membership,
    shopFeature(platform, otherCharges),
    launchesFeature(platform),
    announcementsFeature(platform),
  ];
  // The books read other features' numbers through what each feature offers the dashboard.
  const sources = Object.assign({}, ...features.map((f) => f.dashboard ?? {}));
  const books = booksFeature(platform, () => sources);
  // A person's download and deletion go over every feature's part; the account's own part is run last by the service.
  const accounts = accountsFeature(
    platform,
    features.flatMap((f) => f.personalData ?? []),
  );
  return [accounts, uploadsFeature(platform), ...features, books, seoFeature(platform)];
}
