import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { Profile, User } from '@contracts/account/account-answers';
import type {
  DeleteAccountInput,
  PasswordChangeInput,
  PasswordResetConfirmInput,
  PasswordResetRequestInput,
  ProfileInput,
  TokenInput,
} from '@contracts/account/account-schemas';

const quiet = () => ({ context: new HttpContext().set(QUIET_ERRORS, true) });

/** Account calls other than sign-in and sign-out (those live in SessionStore). */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  /** Confirms the e-mail address with the token from the link; errors are the page's to show. */
  verifyEmail(token: string): Observable<void> {
    return this.http.post<void>('/api/auth/verify', { token } satisfies TokenInput, quiet());
  }
  /** Sends the verification e-mail again to the signed-in address. */
  resendVerification(): Observable<unknown> {
    return this.http.post('/api/auth/verify/resend', {});
  }
  /** Asks for a password-reset e-mail; the answer is the same whether or not the address has an account. */
  requestReset(email: string): Observable<unknown> {
    return this.http.post('/api/auth/password-reset', { email } satisfies PasswordResetRequestInput, quiet());
  }
  /** Sets a new password with the token from the reset e-mail. */
  confirmReset(token: string, password: string): Observable<void> {
    return this.http.post<void>(
      '/api/auth/password-reset/confirm',
      { token, password } satisfies PasswordResetConfirmInput,
      quiet(),
    );
  }
  /** The signed-in person's profile and their choice about marketing mail. */
  profile(): Observable<Profile> {
    return this.http.get<Profile>('/api/account/profile');
  }
  /** Saves the display name or marketing choice; refusals come back for the fields. */
  updateProfile(patch: ProfileInput): Observable<{ user: User }> {
    return this.http.patch<{ user: User }>('/api/account/profile', patch, quiet());
  }
  /** Changes the password after checking the current one; other sessions end on the server. */
  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http.post<void>(
      '/api/account/password',
      { currentPassword, newPassword } satisfies PasswordChangeInput,
      quiet(),
    );
  }
  /** Deletes the signed-in account; the server ends every session of it. */
  deleteAccount(password: string): Observable<{ deleted: true }> {
    return this.http.post<{ deleted: true }>('/api/account/delete', { password } satisfies DeleteAccountInput, quiet());
  }
}
