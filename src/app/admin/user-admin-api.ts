import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { Role, User } from '../core/user';

/** Consecutive failed sign-ins on an account, and whether they locked it. */
export interface SignInLock {
  failures: number;
  locked: boolean;
}

/** An account as admins see it. */
export type AdminUser = User & { disabledAt: string | null; deletedAt: string | null };

export interface UserPage {
  /** `deletedAt`: the owner deleted the account; the row stays (orders and dues point at it) under a neutral name. */
  items: (AdminUser & { createdAt: string; signIn: SignInLock })[];
  total: number;
}

/** One change of an account's roles or state. */
export interface AccountChange {
  id: number;
  kind: 'roles' | 'disabled' | 'enabled';
  added: Role[];
  removed: Role[];
  at: string;
  by: { id: number; name: string } | null;
}

/** Accounts and roles (admin only). */
@Injectable({ providedIn: 'root' })
export class UserAdminApi {
  private readonly http = inject(HttpClient);

  /** One page of accounts, filtered by words, role and state. */
  list(query: {
    q?: string;
    role?: Role;
    state?: 'active' | 'disabled';
    page: number;
    pageSize: number;
  }): Observable<UserPage> {
    let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize);
    if (query.q) params = params.set('q', query.q);
    if (query.role) params = params.set('role', query.role);
    if (query.state) params = params.set('state', query.state);
    return this.http.get<UserPage>('/api/admin/users', { params });
  }

  /** Lifts the lock that repeated wrong passwords put on an account. */
  clearSignInLock(id: number): Observable<void> {
    return this.http.delete<void>(`/api/admin/users/${id}/sign-in-lock`);
  }

  /** Sets an account's roles; the server ends its other sessions when they change. */
  setRoles(id: number, roles: Role[]): Observable<{ user: AdminUser }> {
    return this.http.patch<{ user: AdminUser }>(
      `/api/admin/users/${id}`,
      { roles },
      { context: new HttpContext().set(QUIET_ERRORS, false) },
    );
  }

  /** Disables or enables an account; disabling ends its sessions. */
  setDisabled(id: number, disabled: boolean): Observable<{ user: AdminUser }> {
    return this.http.post<{ user: AdminUser }>(`/api/admin/users/${id}/${disabled ? 'disable' : 'enable'}`, {});
  }

  /** An account's role and state changes, newest first. */
  history(id: number): Observable<AccountChange[]> {
    return this.http.get<{ items: AccountChange[] }>(`/api/admin/users/${id}/history`).pipe(map((r) => r.items));
  }
}
