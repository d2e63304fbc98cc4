import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { Role, User } from '../core/user';

/** Consecutive failed sign-ins on an account, and whether they locked it. */
export interface SignInLock {
  failures: number;
  locked: boolean;
}

export interface UserPage {
  /** `deletedAt`: the owner deleted the account; the row stays (orders and dues point at it) under a neutral name. */
  items: (User & { createdAt: string; deletedAt: string | null; signIn: SignInLock })[];
  total: number;
}

/** Accounts and roles (admin only). */
@Injectable({ providedIn: 'root' })
export class UserAdminApi {
  private readonly http = inject(HttpClient);

  list(query: { q?: string; page: number; pageSize: number }): Observable<UserPage> {
    let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize);
    if (query.q) params = params.set('q', query.q);
    return this.http.get<UserPage>('/api/admin/users', { params });
  }

  clearSignInLock(id: number): Observable<void> {
    return this.http.delete<void>(`/api/admin/users/${id}/sign-in-lock`);
  }

  setRoles(id: number, roles: Role[]): Observable<{ user: User }> {
    return this.http.patch<{ user: User }>(`/api/admin/users/${id}`, { roles }, { context: new HttpContext().set(QUIET_ERRORS, false) });
  }
}
