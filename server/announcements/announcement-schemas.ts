import { refuseUnrenderable } from '../markdown/markdown-field';
import { AnnouncementBody } from '../../contracts/announcements/announcement-schemas';

export { AnnouncementListQuery } from '../../contracts/announcements/announcement-schemas';

/** POST /api/admin/announcements: the contract's body with the Markdown render check only the server makes. */
export const NewAnnouncementSchema = AnnouncementBody.extend({
  markdown: AnnouncementBody.shape.markdown.superRefine(refuseUnrenderable),
});

/** PATCH /api/admin/announcements/:id (drafts only). */
export const AnnouncementPatchSchema = NewAnnouncementSchema.partial();
