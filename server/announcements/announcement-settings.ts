import { z } from 'zod';
import { defineSetting } from '../settings/settings-service';

/**
 * Who the commercial mail says it comes from: the law asks for the sender's name (the team name), a mailing address
 * and one more way to get in touch (from memory: CASL's identification requirements; see the regulator's guidance).
 * `automaticDropNotices` sends the drop notice to those who asked once a run opens.
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

export type AnnouncementSettings = z.infer<typeof AnnouncementSettingsSchema>;

/** The demo default is an invented address in the fictional town; a real team sets its own. */
export const ANNOUNCEMENT_SETTINGS = defineSetting<AnnouncementSettings>('announcements', AnnouncementSettingsSchema, {
  mailingAddress: 'Box 42, 7 Launch Rail Road, Gopher Flats, MB R0A 0A0, Canada',
  contactEmail: 'hello@padside.test',
  automaticDropNotices: true,
});
