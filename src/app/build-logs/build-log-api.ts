import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { PostDetail, PostPage, PostSummary, TagCount } from '@contracts/build-logs/post-answers';
import type { PostListParams } from '@contracts/build-logs/post-schemas';

/** The public build-log endpoints. */
@Injectable({ providedIn: 'root' })
export class BuildLogApi {
  private readonly http = inject(HttpClient);

  /** One page of published build logs, optionally for one tag. */
  list(query: PostListParams): Observable<PostPage<PostSummary>> {
    let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize);
    if (query.tag) params = params.set('tag', query.tag);
    return this.http.get<PostPage<PostSummary>>('/api/posts', { params });
  }

  /** Every tag on published posts, with how many posts carry it. */
  tags(): Observable<{ items: TagCount[] }> {
    return this.http.get<{ items: TagCount[] }>('/api/posts/tags');
  }

  /**
   * An unknown slug is the post page's to say ("not found"), not a snack bar's. `personal` (someone is signed in)
   * skips the server render's visitor copy, so a member gets the members-only body.
   */
  get(slug: string, personal = false): Observable<PostDetail> {
    return this.http.get<PostDetail>(`/api/posts/${encodeURIComponent(slug)}`, {
      context: new HttpContext().set(QUIET_ERRORS, true),
      transferCache: !personal,
    });
  }
}
