import { Router } from 'express';
import type { Feed } from 'feed';
import { HAZARD_NOTICE } from './hazard-rule';
import type { PostReadService } from './post-read-service';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** Builds the feed of the latest build logs; members-only posts carry their summary and a prompt only. */
async function buildFeed(posts: PostReadService, publicUrl: string, teamName: string): Promise<Feed> {
  const items = await posts.feedItems(30);
  // feed 6 ships only ES modules; loading it on first use keeps every other route independent of it.
  const { Feed: FeedClass } = await import('feed');
  const feed = new FeedClass({
    title: `${teamName} build logs — Padside`,
    description: 'How our printed rockets, fin cans and altimeter bays were made, and how they flew.',
    id: `${publicUrl}/build-logs`,
    link: `${publicUrl}/build-logs`,
    language: 'en-CA',
    copyright: teamName,
    updated: items[0]?.publishedAt ?? new Date(0),
    feedLinks: { rss: `${publicUrl}/feeds/build-logs.rss`, atom: `${publicUrl}/feeds/build-logs.atom` },
  });
  for (const p of items) {
    const link = `${publicUrl}/build-logs/${p.slug}`;
    const notice = p.hazardNotice ? `<p><strong>Safety first.</strong> ${escapeHtml(HAZARD_NOTICE)}</p>` : '';
    const body =
      p.html ??
      `<p>${escapeHtml(p.summary)}</p><p>This build log is for club members. <a href="${link}">Sign in or join</a> to read it.</p>`;
    // Both formats carry titles and summaries as HTML (Atom type="html"; RSS readers treat them so), so the plain
    // text an editor typed is escaped once here and a reader shows it literally.
    feed.addItem({
      title: escapeHtml(p.title),
      id: link,
      link,
      description: escapeHtml(p.summary),
      content: notice + body,
      date: p.publishedAt,
      author: p.author ? [{ name: p.author }] : undefined,
      category: p.tags.map((t) => ({ name: t })),
    });
  }
  return feed;
}

/** /feeds/build-logs.rss and /feeds/build-logs.atom, outside /api so feed readers get plain URLs. */
export function feedRoutes(posts: PostReadService, publicUrl: string, teamName: string): Router {
  const r = Router();
  r.get('/build-logs.rss', async function rssFeed(_req, res) {
    res.type('application/rss+xml; charset=utf-8').send((await buildFeed(posts, publicUrl, teamName)).rss2());
  });
  r.get('/build-logs.atom', async function atomFeed(_req, res) {
    res.type('application/atom+xml; charset=utf-8').send((await buildFeed(posts, publicUrl, teamName)).atom1());
  });
  return r;
}
