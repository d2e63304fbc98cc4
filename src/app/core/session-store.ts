import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, PLATFORM_ID, computed, inject, signal } from '@angular/core';
import { isPlatformBrowser } from '@angular/common';
import { firstValueFrom } from 'rxjs';
import { QUIET_ERRORS } from './error-interceptor';
import { CsrfToken } from './csrf-token';
import { STAFF_ROLES, type Role, type User } from './user';
import type { LoginInput, RegisterInput } from '@contracts/account/account-schemas';

/** The signed-in user as signals; every sign-in and sign-out goes through here. */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  private readonly http = inject(HttpClient);
  private readonly csrf = inject(CsrfToken);
  private readonly current = signal<User | null>(null);

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  readonly isStaff = computed(() => this.hasAnyRole(STAFF_ROLES));
  /**
   * Settles once the first read of the session has answered. The server renders every page as a visitor, so there
   * it settles at once and never asks; in the browser the first paint does not wait for it, only the guards do.
   */
  readonly ready: Promise<void> = isPlatformBrowser(inject(PLATFORM_ID)) ? this.load() : Promise.resolve();

  /** Whether the signed-in person holds at least one of the roles. */
  hasAnyRole(roles: readonly Role[]): boolean {
    return this.current()?.roles.some((r) => roles.includes(r)) ?? false;
  }

  /** Reads the session (at start-up, and again after a change elsewhere); `user: null` means nobody is signed in. */
  async load(): Promise<void> {
    try {
      const res = await firstValueFrom(
        this.http.get<{ user: User | null }>('/api/auth/me', { context: new HttpContext().set(QUIET_ERRORS, true) }),
      );
      this.current.set(res.user);
    } catch {
      this.current.set(null);
    }
  }

  /** Signs in and keeps the user; a new session means a new CSRF token. */
  async signIn(email: string, password: string): Promise<User> {
    const res = await firstValueFrom(
      this.http.post<{ user: User }>('/api/auth/login', { email, password } satisfies LoginInput, {
        context: new HttpContext().set(QUIET_ERRORS, true),
      }),
    );
    this.csrf.forget();
    this.current.set(res.user);
    return res.user;
  }

  /**
   * Sends a registration; the answer is the same for a new address and a taken one, and nobody is signed in: the
   * message says to confirm the address from the inbox, then sign in.
   */
  async register(email: string, password: string, displayName: string): Promise<string> {
    const res = await firstValueFrom(
      this.http.post<{ queued: true; message: string }>(
        '/api/auth/register',
        { email, password, displayName } satisfies RegisterInput,
        { context: new HttpContext().set(QUIET_ERRORS, true) },
      ),
    );
    return res.message;
  }

  /** Signs out and forgets the user and the CSRF token. */
  async signOut(): Promise<void> {
    await firstValueFrom(this.http.post('/api/auth/logout', {}));
    this.csrf.forget();
    this.current.set(null);
  }

  /** After the account was deleted: the server already ended the session, so only the page forgets it. */
  forgetDeleted(): void {
    this.csrf.forget();
    this.current.set(null);
  }

  /** After a profile change. */
  replace(user: User): void {
    this.current.set(user);
  }
}
