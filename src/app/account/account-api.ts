import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { User } from '../core/user';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Account calls other than sign-in and sign-out (those live in SessionStore). */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  verifyEmail(token: string): Observable<void> {
    return this.http.post<void>('/api/auth/verify', { token }, quiet());
  }
  resendVerification(): Observable<unknown> {
    return this.http.post('/api/auth/verify/resend', {});
  }
  requestReset(email: string): Observable<unknown> {
    return this.http.post('/api/auth/password-reset', { email }, quiet());
  }
  confirmReset(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset/confirm', { token, password }, quiet());
  }
  profile(): Observable<{ user: User; marketingOptOut: boolean }> {
    return this.http.get<{ user: User; marketingOptOut: boolean }>('/api/account/profile');
  }
  updateProfile(patch: { displayName?: string; marketingOptOut?: boolean }): Observable<{ user: User }> {
    return this.http.patch<{ user: User }>('/api/account/profile', patch, quiet());
  }
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http.post<void>('/api/account/password', { currentPassword, newPassword }, quiet());
  }
  /** Deletes the signed-in account; the server ends every session of it. */
  deleteAccount(password: string): Observable<{ deleted: true }> {
    return this.http.post<{ deleted: true }>('/api/account/delete', { password }, quiet());
  }
}
