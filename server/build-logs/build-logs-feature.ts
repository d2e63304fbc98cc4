import type { Feature, Platform } from '../feature';
import type { SponsorCredits } from '../sponsors/sponsors-feature';
import { feedRoutes } from './feed-routes';
import { PostRepository } from './post-repository';
import { postAdminRoutes, postPublicRoutes } from './post-routes';
import { PostService } from './post-service';

/** Build logs, their feeds and scheduled publishing; a post's sponsor credits are kept by the sponsors feature. */
export function buildLogsFeature(platform: Platform, sponsorCredits: SponsorCredits): Feature {
  const { db, clock, config } = platform.deps;
  const postRepo = new PostRepository(db);
  const posts = new PostService(db, postRepo, sponsorCredits.sponsors, sponsorCredits.credits, (urls) =>
    platform.images.describe(urls),
  );
  return {
    name: 'build-logs',
    mount(api) {
      api('/posts', postPublicRoutes(posts));
      api('/admin/posts', postAdminRoutes(posts, clock));
    },
    mountSite(site) {
      site('/feeds', feedRoutes(posts, config.publicUrl, config.site.teamName));
    },
    imageUses: async (urls) => (await postRepo.titlesUsingImage(urls)).map((t) => `the build log “${t}”`),
    jobs: [{ name: 'publish-scheduled-posts', cron: '* * * * *', run: () => posts.publishDue(clock.now()) }],
  };
}
