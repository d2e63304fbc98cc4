import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';

/** One row of the public list. */
export interface PostSummary {
  slug: string;
  title: string;
  summary: string;
  coverUrl: string | null;
  /** The uploaded cover's sizes and WebP thumbnail; null for a cover from elsewhere or none. */
  cover?: { url: string; thumbnailUrl: string; width: number; height: number } | null;
  publishedAt: string;
  tags: string[];
  membersOnly: boolean;
}

/** A published post as the page shows it; `html` is null when the body is for members. */
export interface PostDetail extends PostSummary {
  author: string | null;
  /** The last edit (never before publishing). */
  updatedAt?: string;
  html: string | null;
  credits: { sponsorId: number; name: string; slug: string }[];
  hazardNotice: boolean;
}

/** The public build-log endpoints. */
@Injectable({ providedIn: 'root' })
export class BuildLogApi {
  private readonly http = inject(HttpClient);

  list(query: { tag?: string; page: number; pageSize: number }): Observable<{ items: PostSummary[]; total: number }> {
    let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize);
    if (query.tag) params = params.set('tag', query.tag);
    return this.http.get<{ items: PostSummary[]; total: number }>('/api/posts', { params });
  }

  tags(): Observable<{ items: { tag: string; count: number }[] }> {
    return this.http.get<{ items: { tag: string; count: number }[] }>('/api/posts/tags');
  }

  /**
   * An unknown slug is the post page's to say ("not found"), not a snack bar's. `personal` (someone is signed in)
   * skips the server render's visitor copy, so a member gets the members-only body.
   */
  get(slug: string, personal = false): Observable<PostDetail> {
    return this.http.get<PostDetail>(`/api/posts/${encodeURIComponent(slug)}`, { context: new HttpContext().set(QUIET_ERRORS, true), transferCache: !personal });
  }
}
