import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { parseContentFile } from '../../server/build-logs/content-import';
import { needsHazardNotice } from '../../server/build-logs/hazard-rule';
import { slugify } from '../../server/platform/slug';
import { creditMarkerSlugs, renderMarkdown } from '../../server/markdown/render-markdown';
import { SPONSORS } from '../../seeds/04_build_logs_sponsors';

const dir = path.resolve(__dirname, '../../content');
const posts = readdirSync(dir)
  .filter((f) => f.endsWith('.md'))
  .map((f) => parseContentFile(f, readFileSync(path.join(dir, f), 'utf8')));
const sponsorSlugs = SPONSORS.map((s) => slugify(s.name));

describe('the demo build logs in content/', () => {
  it('are 3 to 5 posts with valid front matter, unique slugs and one members-only post', () => {
    expect(posts.length).toBeGreaterThanOrEqual(3);
    expect(posts.length).toBeLessThanOrEqual(5);
    expect(new Set(posts.map((p) => p.slug)).size).toBe(posts.length);
    expect(posts.filter((p) => p.membersOnly)).toHaveLength(1);
  });

  it('credit only the seeded sponsors, in front matter and in markers alike', () => {
    for (const p of posts) {
      expect(sponsorSlugs).toEqual(expect.arrayContaining(p.credits));
      expect(sponsorSlugs).toEqual(expect.arrayContaining(creditMarkerSlugs(p.markdown)));
    }
  });

  it('render through the pipeline, and the flight report carries the hazard notice', () => {
    for (const p of posts) expect(renderMarkdown(p.markdown).length).toBeGreaterThan(100);
    expect(needsHazardNotice(posts.find((p) => p.slug === 'first-flight-gopher-flats')!)).toBe(true);
  });

  it('refuses front matter with a missing title, naming the file', () => {
    expect(() =>
      parseContentFile('broken.md', '---\nslug: x\npublishedAt: 2026-01-01\nauthor: a@b.test\n---\nbody'),
    ).toThrow(/broken\.md: title/);
  });
});
