import {
  AnnouncementSettingsSchema,
  type AnnouncementSettings,
} from '../../contracts/announcements/announcement-schemas';
import { defineSetting } from '../settings/settings-service';

export { AnnouncementSettingsSchema, type AnnouncementSettings };

/** The demo default is an invented address in the fictional town; a real team sets its own. */
export const ANNOUNCEMENT_SETTINGS = defineSetting<AnnouncementSettings>('announcements', AnnouncementSettingsSchema, {
  mailingAddress: 'Box 42, 7 Launch Rail Road, Gopher Flats, MB R0A 0A0, Canada',
  contactEmail: 'hello@padside.test',
  automaticDropNotices: true,
});
