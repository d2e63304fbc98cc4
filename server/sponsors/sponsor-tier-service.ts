import type { PostTitles } from '../build-logs/build-logs-feature';
import type { SettingsService } from '../settings/settings-service';
import type { StoredImage } from '../uploads/image-uploads';
import type { AgreementRepository } from './agreement-repository';
import type { SponsorRepository } from './sponsor-repository';
import { seasonOf, SPONSOR_TIERS, tierFor, type Tier } from './sponsor-tiers';
import { toView, type SponsorView } from './sponsor-views';

/** The sponsor tiers, the tier each sponsor holds this season, and the public sponsors page; no HTTP here. */
export class SponsorTierService {
  constructor(
    private readonly sponsors: SponsorRepository,
    private readonly agreements: AgreementRepository,
    private readonly settings: SettingsService,
    /** The posts crediting each sponsor, lent by the build logs. */
    private readonly posts: PostTitles,
    /** Sizes of uploaded logos, so the sponsors page can reserve each logo's space before it loads. */
    private readonly describeImages: (urls: readonly string[]) => Promise<Map<string, StoredImage>> = async () =>
      new Map(),
  ) {}

  /** The sponsor tiers as configured. */
  tiers(): Promise<{ tiers: Tier[] }> {
    return this.settings.get(SPONSOR_TIERS);
  }

  /** Saves the sponsor tiers, lowest threshold first, so the tier rule can read them in order. */
  setTiers(value: { tiers: Tier[] }): Promise<{ tiers: Tier[] }> {
    return this.settings.put(SPONSOR_TIERS, { tiers: [...value.tiers].sort((a, b) => a.minCents - b.minCents) });
  }

  /** The sponsors the public page lists now: those holding a tier this season. */
  async listedNow(today: string): Promise<Set<number>> {
    return new Set((await this.withTiers(today)).filter((s) => s.tier !== null).map((s) => s.id));
  }

  /** Every sponsor with the tier its current-season total reaches (null without an agreement this season). */
  async withTiers(today: string): Promise<(SponsorView & { tier: string | null; seasonTotalCents: number })[]> {
    const season = seasonOf(today);
    const [rows, totals, { tiers }] = await Promise.all([
      this.sponsors.all(),
      this.agreements.seasonTotals(season),
      this.tiers(),
    ]);
    return rows.map((s) => {
      const total = totals.get(s.id);
      return {
        ...toView(s),
        tier: total === undefined ? null : (tierFor(total, tiers)?.name ?? null),
        seasonTotalCents: total ?? 0,
      };
    });
  }

  /** The public sponsors page: tiers from the highest down, each sponsor with the posts that credit it. */
  async publicWall(today: string): Promise<{
    season: string;
    tiers: {
      name: string;
      sponsors: (SponsorView & {
        logoSize: { width: number; height: number } | null;
        posts: { slug: string; title: string }[];
      })[];
    }[];
  }> {
    const [sponsors, posts, { tiers }] = await Promise.all([
      this.withTiers(today),
      this.posts.publishedCredits(),
      this.tiers(),
    ]);
    const logos = await this.describeImages(sponsors.flatMap((s) => (s.logoUrl ? [s.logoUrl] : [])));
    const ordered = [...tiers].sort((a, b) => b.minCents - a.minCents);
    return {
      season: seasonOf(today),
      tiers: ordered
        .map((t) => ({
          name: t.name,
          sponsors: sponsors
            .filter((s) => s.tier === t.name)
            .sort((a, b) => b.seasonTotalCents - a.seasonTotalCents || a.name.localeCompare(b.name))
            .map((s) => ({
              id: s.id,
              slug: s.slug,
              name: s.name,
              website: s.website,
              blurb: s.blurb,
              logoUrl: s.logoUrl,
              logoSize: logoSizeOf(logos, s.logoUrl),
              posts: posts.filter((p) => p.sponsorId === s.id).map((p) => ({ slug: p.slug, title: p.title })),
            })),
        }))
        .filter((t) => t.sponsors.length),
    };
  }
}

/** A logo's stored size in pixels; null when the address is not a stored upload. */
function logoSizeOf(logos: Map<string, StoredImage>, url: string | null): { width: number; height: number } | null {
  const logo = url ? logos.get(url) : undefined;
  return logo ? { width: logo.width, height: logo.height } : null;
}
