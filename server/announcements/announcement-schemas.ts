import { z } from 'zod';
import { refuseUnrenderable } from '../markdown/markdown-field';
import { fields } from '../platform/validate';
import { TOPICS } from './topics';

const topic = z.enum(TOPICS, { error: 'Choose a list: drops, launches or build-logs.' });
const token = z.strictObject({
  token: z
    .string({ error: 'The link is missing its token.' })
    .min(1, 'The link is missing its token.')
    .max(600, 'Not a valid link.'),
});

/** POST /api/subscriptions. */
export const SignUpSchema = z.strictObject({
  email: fields.email,
  topics: z
    .array(topic, { error: 'Tick at least one list.' })
    .min(1, 'Tick at least one list.')
    .max(TOPICS.length, 'Each list once.'),
  productId: fields.id.optional(),
  page: z.enum(['home', 'product', 'account'], { error: 'Unknown page.' }).default('home'),
});

/** `?token=` of the confirmation and unsubscribe links. */
export const TokenQuery = token;

const subject = z
  .string({ error: 'Write a subject.' })
  .trim()
  .min(1, 'Write a subject.')
  .max(200, 'At most 200 characters.');
const markdown = z
  .string({ error: 'Write the message.' })
  .trim()
  .min(1, 'Write the message.')
  .max(50_000, 'At most 50,000 characters.')
  .superRefine(refuseUnrenderable);

/** POST /api/admin/announcements. */
export const NewAnnouncementSchema = z.strictObject({ topic, subject, markdown });

/** PATCH /api/admin/announcements/:id (drafts only). */
export const AnnouncementPatchSchema = NewAnnouncementSchema.partial();

/** GET /api/admin/announcements. */
export const AnnouncementListQuery = z.strictObject({
  page: fields.page,
  pageSize: fields.pageSize,
  sort: z.enum(['created', 'subject', 'topic'], { error: 'Sort by created, subject or topic.' }).default('created'),
  dir: z.enum(['asc', 'desc'], { error: 'asc or desc.' }).default('desc'),
});
