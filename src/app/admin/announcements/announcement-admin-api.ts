import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Topic } from '@contracts/announcements/topics';

export type AnnouncementStatus = 'draft' | 'sending' | 'sent';

/** An announcement with its delivery counts, as the console shows it. */
export interface Announcement {
  id: number;
  kind: 'announcement' | 'drop_notice';
  topic: Topic;
  subject: string;
  markdown: string;
  status: AnnouncementStatus;
  createdAt: string;
  sentAt: string | null;
  counts: { recipients: number; queued: number; sent: number; failed: number; suppressed: number };
}

/** The mail as a recipient gets it. */
export interface AnnouncementPreview {
  subject: string;
  text: string;
  html: string;
  headers: Record<string, string>;
}

export interface AnnouncementDraft {
  topic: Topic;
  subject: string;
  markdown: string;
}

export interface AnnouncementQuery {
  page: number;
  pageSize: number;
  sort: 'created' | 'subject' | 'topic';
  dir: 'asc' | 'desc';
}

/** Who the commercial mail names as its sender, and whether opening runs send drop notices by themselves. */
export interface AnnouncementSettings {
  mailingAddress: string;
  contactEmail: string;
  automaticDropNotices: boolean;
}

/** The console's announcement calls (editor, admin). */
@Injectable({ providedIn: 'root' })
export class AnnouncementAdminApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/admin/announcements';

  /** One page of announcements for the console list. */
  list(q: AnnouncementQuery) {
    return this.http.get<{ items: Announcement[]; total: number; page: number; pageSize: number }>(this.base, {
      params: { ...q },
    });
  }

  /** One announcement, for the compose screen. */
  get(id: number) {
    return this.http.get<{ announcement: Announcement }>(`${this.base}/${id}`);
  }

  /** Saves a new draft announcement. */
  create(body: AnnouncementDraft) {
    return this.http.post<{ announcement: Announcement }>(this.base, body);
  }

  /** Saves changes to a draft announcement. */
  update(id: number, body: AnnouncementDraft) {
    return this.http.patch<{ announcement: Announcement }>(`${this.base}/${id}`, body);
  }

  /** The announcement as its readers will get it, footer and unsubscribe link included. */
  preview(id: number) {
    return this.http.get<AnnouncementPreview>(`${this.base}/${id}/preview`);
  }

  /** Sends one copy to the signed-in staff address before the real send. */
  test(id: number) {
    return this.http.post<{ to: string }>(`${this.base}/${id}/test`, {});
  }

  /** The sender identity and postal address every commercial message carries. */
  settings() {
    return this.http.get<AnnouncementSettings>(`${this.base}/settings`);
  }

  /** Saves the sender identity and postal address. */
  saveSettings(body: AnnouncementSettings) {
    return this.http.put<AnnouncementSettings>(`${this.base}/settings`, body);
  }

  /** Queues the announcement to everyone its list allows; the server checks consent and suppression per address. */
  send(id: number) {
    return this.http.post<{ announcement: Announcement }>(`${this.base}/${id}/send`, {});
  }
}
