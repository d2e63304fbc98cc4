import { HttpClient, HttpContext, HttpEvent, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';

export type PostStatus = 'draft' | 'scheduled' | 'published';

export interface AdminPostRow {
  id: number;
  slug: string;
  title: string;
  status: PostStatus;
  publishAt: string | null;
  publishedAt: string | null;
  updatedAt: string;
  membersOnly: boolean;
  tags: string[];
}

export interface AdminPost {
  id: number;
  slug: string;
  title: string;
  summary: string;
  coverUrl: string | null;
  markdown: string;
  tags: string[];
  status: PostStatus;
  publishAt: string | null;
  publishedAt: string | null;
  membersOnly: boolean;
  hazardNotice: boolean;
  hazardRequired: boolean;
  credits: { sponsorId: number; name: string; slug: string }[];
}

export interface PostWrite {
  title: string;
  slug?: string;
  markdown: string;
  summary: string;
  coverUrl: string | null;
  tags: string[];
  membersOnly: boolean;
  status: PostStatus;
  publishAt: string | null;
  credits: number[];
  hazardNotice: boolean;
}

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The editors' post endpoints and the shared image upload. */
@Injectable({ providedIn: 'root' })
export class PostAdminApi {
  private readonly http = inject(HttpClient);

  list(q: { status?: PostStatus; q?: string; sort: string; dir: string; page: number; pageSize: number }): Observable<{ items: AdminPostRow[]; total: number }> {
    let params = new HttpParams().set('sort', q.sort).set('dir', q.dir).set('page', q.page).set('pageSize', q.pageSize);
    if (q.status) params = params.set('status', q.status);
    if (q.q) params = params.set('q', q.q);
    return this.http.get<{ items: AdminPostRow[]; total: number }>('/api/admin/posts', { params });
  }

  get(id: number): Observable<AdminPost> {
    return this.http.get<AdminPost>(`/api/admin/posts/${id}`);
  }

  create(body: PostWrite): Observable<{ id: number; slug: string }> {
    return this.http.post<{ id: number; slug: string }>('/api/admin/posts', body, quiet());
  }

  update(id: number, body: PostWrite): Observable<{ id: number; slug: string }> {
    return this.http.put<{ id: number; slug: string }>(`/api/admin/posts/${id}`, body, quiet());
  }

  preview(body: { markdown: string; title: string; summary: string; tags: string[] }): Observable<{ html: string; hazardNotice: boolean; unknownSponsors: string[] }> {
    return this.http.post<{ html: string; hazardNotice: boolean; unknownSponsors: string[] }>('/api/admin/posts/preview', body, quiet());
  }

  /** Every upload event, so the caller can show progress. */
  upload(file: File): Observable<HttpEvent<{ url: string; thumbnailUrl: string }>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<{ url: string; thumbnailUrl: string }>('/api/admin/uploads', form, { reportProgress: true, observe: 'events', ...quiet() });
  }
}
