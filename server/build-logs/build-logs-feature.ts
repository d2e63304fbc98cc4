import type { Knex } from 'knex';
import type { Feature, Platform } from '../feature';
import type { SponsorCredits } from '../sponsors/sponsors-feature';
import { buildLogsPersonalData } from './build-logs-personal-data';
import { feedRoutes } from './feed-routes';
import { PostRepository } from './post-repository';
import { PostReadService } from './post-read-service';
import { postAdminRoutes, postPublicRoutes } from './post-routes';
import { PostService } from './post-service';

/** What the build logs lend the sponsors: the address and title of the posts that credit them, looked up in batches. */
export interface PostTitles {
  /** The slug and title of each of these posts, by post id. */
  byIds(ids: readonly number[]): Promise<Map<number, { slug: string; title: string }>>;
  /** Published posts with the sponsor each credits, newest first. */
  publishedCredits(): Promise<{ sponsorId: number; slug: string; title: string }[]>;
}

/** The post lookup the sponsors feature is built with, before the build logs themselves (which need its credits). */
export function postTitles(db: Knex): PostTitles {
  const repo = new PostRepository(db);
  return { byIds: (ids) => repo.titlesByIds(ids), publishedCredits: () => repo.publishedCredits() };
}

/** Build logs, their feeds and scheduled publishing; a post's sponsor credits are kept by the sponsors feature. */
export function buildLogsFeature(platform: Platform, sponsorCredits: SponsorCredits): Feature {
  const { db, clock, config } = platform.deps;
  const postRepo = new PostRepository(db);
  const describeImages = (urls: readonly string[]) => platform.images.describe(urls);
  const reads = new PostReadService(postRepo, sponsorCredits.sponsors, describeImages);
  const posts = new PostService(db, postRepo, sponsorCredits.sponsors, sponsorCredits.credits);
  return {
    name: 'build-logs',
    mount(api) {
      api('/posts', postPublicRoutes(reads));
      api('/admin/posts', postAdminRoutes(posts, reads, clock));
    },
    mountSite(site) {
      site('/feeds', feedRoutes(reads, config.publicUrl, config.site.teamName));
    },
    imageUses: async (urls) => (await postRepo.titlesUsingImage(urls)).map((t) => `the build log “${t}”`),
    personalData: buildLogsPersonalData,
    jobs: [{ name: 'publish-scheduled-posts', cron: '* * * * *', run: () => posts.publishDue(clock.now()) }],
  };
}
