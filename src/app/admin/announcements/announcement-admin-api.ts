import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  AnnouncementAnswer,
  AnnouncementPage,
  AnnouncementPreview,
  AnnouncementTestAnswer,
} from '@contracts/announcements/announcement-answers';
import type {
  AnnouncementDraft,
  AnnouncementQuery,
  AnnouncementSettings,
} from '@contracts/announcements/announcement-schemas';

/** The console's announcement calls (editor, admin). */
@Injectable({ providedIn: 'root' })
export class AnnouncementAdminApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/admin/announcements';

  /** One page of announcements for the console list. */
  list(q: AnnouncementQuery) {
    return this.http.get<AnnouncementPage>(this.base, {
      params: { ...q },
    });
  }

  /** One announcement, for the compose screen. */
  get(id: number) {
    return this.http.get<AnnouncementAnswer>(`${this.base}/${id}`);
  }

  /** Saves a new draft announcement. */
  create(body: AnnouncementDraft) {
    return this.http.post<AnnouncementAnswer>(this.base, body);
  }

  /** Saves changes to a draft announcement. */
  update(id: number, body: AnnouncementDraft) {
    return this.http.patch<AnnouncementAnswer>(`${this.base}/${id}`, body);
  }

  /** The announcement as its readers will get it, footer and unsubscribe link included. */
  preview(id: number) {
    return this.http.get<AnnouncementPreview>(`${this.base}/${id}/preview`);
  }

  /** Sends one copy to the signed-in staff address before the real send. */
  test(id: number) {
    return this.http.post<AnnouncementTestAnswer>(`${this.base}/${id}/test`, {});
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
    return this.http.post<AnnouncementAnswer>(`${this.base}/${id}/send`, {});
  }
}
