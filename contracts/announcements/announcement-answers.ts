/** What the console's announcement routes answer (/api/admin/announcements): the server types its views with these;
 * the console reads them. */
import type { Topic } from './topics';

/** Draft until sent; sending while the outbox still holds its mail; then sent. */
export type AnnouncementStatus = 'draft' | 'sending' | 'sent';

/** An announcement with its delivery counts, as the console shows it; times are ISO instants. */
export interface Announcement {
  id: number;
  kind: 'announcement' | 'drop_notice';
  topic: Topic;
  subject: string;
  markdown: string;
  status: AnnouncementStatus;
  /** The product a drop notice is about; null for a staff announcement. */
  productId: number | null;
  createdAt: string;
  sentAt: string | null;
  counts: { recipients: number; queued: number; sent: number; failed: number; suppressed: number };
}

/** One announcement (create, show, update, send). */
export interface AnnouncementAnswer {
  announcement: Announcement;
}

/** One page of the console's announcement table. */
export interface AnnouncementPage {
  items: Announcement[];
  total: number;
  page: number;
  pageSize: number;
}

/** The mail as a recipient gets it. */
export interface AnnouncementPreview {
  subject: string;
  text: string;
  /** Absent only for a mail with no HTML part (commercial mail always has one). */
  html?: string;
  headers: Record<string, string>;
}

/** Where the test copy went. */
export interface AnnouncementTestAnswer {
  to: string;
}
