/** The console's announcement bodies and list query (/api/admin/announcements): the server parses with them (adding
 * its Markdown render check to the message); the console takes their types. */
import { z } from 'zod';
import { fields } from '../forms/fields';
import { TopicField as topic } from './subscription-schemas';

const subject = z
  .string({ error: 'Write a subject.' })
  .trim()
  .min(1, 'Write a subject.')
  .max(200, 'At most 200 characters.');
const markdown = z
  .string({ error: 'Write the message.' })
  .trim()
  .min(1, 'Write the message.')
  .max(50_000, 'At most 50,000 characters.');

/** POST /api/admin/announcements: a draft's list, subject and Markdown message. */
export const AnnouncementBody = z.strictObject({ topic, subject, markdown });

/** GET /api/admin/announcements. */
export const AnnouncementListQuery = z.strictObject({
  page: fields.page,
  pageSize: fields.pageSize,
  sort: z.enum(['created', 'subject', 'topic'], { error: 'Sort by created, subject or topic.' }).default('created'),
  dir: z.enum(['asc', 'desc'], { error: 'asc or desc.' }).default('desc'),
});

/**
 * PUT /api/admin/announcements/settings. Who the commercial mail says it comes from: the law asks for the sender's
 * name (the team name), a mailing address and one more way to get in touch (from memory: CASL's identification
 * requirements; see the regulator's guidance). `automaticDropNotices` sends the drop notice to those who asked once a
 * run opens.
 */
export const AnnouncementSettingsSchema = z.strictObject({
  mailingAddress: z
    .string({ error: 'Give a full mailing address.' })
    .trim()
    .min(10, 'Give a full mailing address.')
    .max(300, 'Too long.'),
  contactEmail: z
    .string({ error: 'Enter an e-mail address.' })
    .trim()
    .max(254, 'Too long.')
    .pipe(z.email({ error: 'Enter an e-mail address.' })),
  automaticDropNotices: z.boolean({ error: 'Yes or no.' }),
});

/** A draft announcement: its list, subject and Markdown message. */
export type AnnouncementDraft = z.infer<typeof AnnouncementBody>;
/** The console's list query, every field set. */
export type AnnouncementQuery = z.infer<typeof AnnouncementListQuery>;
/** The sender identity and postal address every commercial message carries, and the drop-notice switch. */
export type AnnouncementSettings = z.infer<typeof AnnouncementSettingsSchema>;
