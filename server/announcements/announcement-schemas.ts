import { z } from 'zod';
import { refuseUnrenderable } from '../markdown/markdown-field';
import { fields } from '../platform/validate';
import { TopicField as topic } from '../../contracts/announcements/subscription-schemas';

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
