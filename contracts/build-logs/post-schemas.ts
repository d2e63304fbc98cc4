/**
 * Request bodies and queries of the build-log routes: the server parses with them (adding the Markdown render check,
 * which needs the server's renderer); the app takes their types.
 */
import { z } from 'zod';
import { fields } from '../forms/fields';

const POST_STATUSES = ['draft', 'scheduled', 'published'] as const;
const tag = z
  .string()
  .trim()
  .toLowerCase()
  .regex(/^[a-z0-9][a-z0-9-]{0,29}$/, 'Tags are lower-case words or hyphenated words, up to 30 characters.');

/** POST /api/admin/posts and PUT /api/admin/posts/:id. */
export const PostBody = z.object({
  title: z
    .string({ error: 'Title is required.' })
    .trim()
    .min(1, 'Title is required.')
    .max(160, 'Use at most 160 characters.'),
  slug: z
    .string()
    .trim()
    .regex(/^[a-z0-9][a-z0-9-]{0,119}$/, 'Use lower-case letters, digits and hyphens.')
    .optional()
    .or(z.literal('').transform(() => undefined)),
  markdown: z
    .string({ error: 'Write the post first.' })
    .min(1, 'Write the post first.')
    .max(200_000, 'The post is too long (200,000 characters at most).'),
  summary: z.string().trim().max(400, 'Use at most 400 characters.').optional(),
  coverUrl: fields.uploadedImage,
  tags: z.array(tag, { error: 'Send a list of tags.' }).max(12, 'At most 12 tags.').optional(),
  membersOnly: z.boolean().optional(),
  status: z.enum(POST_STATUSES, { error: 'Status is draft, scheduled or published.' }),
  publishAt: z.iso
    .datetime({ offset: true, error: 'Use a date and time like 2026-12-24T18:00:00Z.' })
    .nullish()
    .transform((s) => (s ? new Date(s) : null)),
  credits: z.array(fields.id, { error: 'Send a list of sponsor ids.' }).max(20).optional(),
  hazardNotice: z.boolean().optional(),
});

/** POST /api/admin/posts/preview. */
export const PostPreviewBody = z.object({
  markdown: z
    .string({ error: 'Send the Markdown to preview.' })
    .max(200_000, 'The post is too long (200,000 characters at most).'),
  title: z.string().max(160).optional(),
  summary: z.string().max(400).optional(),
  tags: z.array(z.string().max(30)).max(12).optional(),
});

/** GET /api/posts. */
export const PostListQuery = z.object({
  tag: tag.optional(),
  page: fields.page,
  pageSize: z.coerce.number().int().min(1).max(50).default(10),
});

/** GET /api/admin/posts. */
export const AdminPostListQuery = z.object({
  status: z.enum(POST_STATUSES).optional(),
  q: z.string().trim().max(100).optional(),
  sort: z.enum(['updated', 'title', 'published']).default('updated'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: fields.page,
  pageSize: fields.pageSize,
});

/** A post as the editor form sends it. */
export type PostBodyInput = z.input<typeof PostBody>;
/** What the editor previews. */
export type PostPreviewInput = z.input<typeof PostPreviewBody>;
/** The public list's query, every default filled in, as the app sends it. */
export type PostListParams = z.infer<typeof PostListQuery>;
/** The editors' table query, every default filled in, as the app sends it. */
export type AdminPostListParams = z.infer<typeof AdminPostListQuery>;
