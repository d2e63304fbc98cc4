import { HttpClient, HttpContext, HttpEvent, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../../core/error-interceptor';
import type { AdminPost, AdminPostRow, PostPage, PostPreview, PostSaved } from '@contracts/build-logs/post-answers';
import type { AdminPostListParams, PostBodyInput, PostPreviewInput } from '@contracts/build-logs/post-schemas';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** The editors' post endpoints and the shared image upload. */
@Injectable({ providedIn: 'root' })
export class PostAdminApi {
  private readonly http = inject(HttpClient);

  /** One page of posts for the editor's list, filtered and sorted. */
  list(q: AdminPostListParams): Observable<PostPage<AdminPostRow>> {
    let params = new HttpParams().set('sort', q.sort).set('dir', q.dir).set('page', q.page).set('pageSize', q.pageSize);
    if (q.status) params = params.set('status', q.status);
    if (q.q) params = params.set('q', q.q);
    return this.http.get<PostPage<AdminPostRow>>('/api/admin/posts', { params });
  }

  /** One post with its Markdown, for the editor. */
  get(id: number): Observable<AdminPost> {
    return this.http.get<AdminPost>(`/api/admin/posts/${id}`);
  }

  /** Saves a new post; refusals come back for the fields. */
  create(body: PostBodyInput): Observable<PostSaved> {
    return this.http.post<PostSaved>('/api/admin/posts', body, quiet());
  }

  /** Saves an edited post. */
  update(id: number, body: PostBodyInput): Observable<PostSaved> {
    return this.http.put<PostSaved>(`/api/admin/posts/${id}`, body, quiet());
  }

  /** The post rendered as readers will see it, whether it needs the hazard notice, and any unknown sponsor in its credits. */
  preview(body: PostPreviewInput): Observable<PostPreview> {
    return this.http.post<PostPreview>('/api/admin/posts/preview', body, quiet());
  }

  /** Every upload event, so the caller can show progress. */
  upload(file: File): Observable<HttpEvent<{ url: string; thumbnailUrl: string }>> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<{ url: string; thumbnailUrl: string }>('/api/admin/uploads', form, {
      reportProgress: true,
      observe: 'events',
      ...quiet(),
    });
  }
}
