import matter from 'gray-matter';
import { z } from 'zod';

/** The front matter a build log in `content/` carries. */
const FrontMatter = z.object({
  title: z.string().min(1),
  slug: z.string().regex(/^[a-z0-9][a-z0-9-]*$/),
  summary: z.string().default(''),
  tags: z.array(z.string()).default([]),
  membersOnly: z.boolean().default(false),
  publishedAt: z.coerce.date(),
  author: z.string().email(),
  credits: z.array(z.string()).default([]),
});

export type ContentPost = z.infer<typeof FrontMatter> & { markdown: string };

/** Parses one Markdown file with front matter; throws with the file name when the front matter is wrong. */
export function parseContentFile(name: string, text: string): ContentPost {
  const { data, content } = matter(text);
  const parsed = FrontMatter.safeParse(data);
  if (!parsed.success)
    throw new Error(`${name}: ${parsed.error.issues.map((i) => `${i.path.join('.')} ${i.message}`).join('; ')}`);
  return { ...parsed.data, markdown: content.trim() + '\n' };
}
