import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { Role } from '../core/user';
import type { AccountChange, AccountPage, AdminAccount } from '@contracts/account/account-admin-answers';
import type { AccountListQuery, RolesInput } from '@contracts/account/account-admin-schemas';

/** Accounts and roles (admin only). */
@Injectable({ providedIn: 'root' })
export class UserAdminApi {
  private readonly http = inject(HttpClient);

  /** One page of accounts, filtered by words, role and state. */
  list(query: AccountListQuery): Observable<AccountPage> {
    let params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize);
    if (query.q) params = params.set('q', query.q);
    if (query.role) params = params.set('role', query.role);
    if (query.state) params = params.set('state', query.state);
    return this.http.get<AccountPage>('/api/admin/users', { params });
  }

  /** Lifts the lock that repeated wrong passwords put on an account. */
  clearSignInLock(id: number): Observable<void> {
    return this.http.delete<void>(`/api/admin/users/${id}/sign-in-lock`);
  }

  /** Sets an account's roles; the server ends its other sessions when they change. */
  setRoles(id: number, roles: Role[]): Observable<{ user: AdminAccount }> {
    return this.http.patch<{ user: AdminAccount }>(`/api/admin/users/${id}`, { roles } satisfies RolesInput, {
      context: new HttpContext().set(QUIET_ERRORS, false),
    });
  }

  /** Disables or enables an account; disabling ends its sessions. */
  setDisabled(id: number, disabled: boolean): Observable<{ user: AdminAccount }> {
    return this.http.post<{ user: AdminAccount }>(`/api/admin/users/${id}/${disabled ? 'disable' : 'enable'}`, {});
  }

  /** An account's role and state changes, newest first. */
  history(id: number): Observable<AccountChange[]> {
    return this.http.get<{ items: AccountChange[] }>(`/api/admin/users/${id}/history`).pipe(map((r) => r.items));
  }
}
