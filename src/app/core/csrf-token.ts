import { HttpBackend, HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map, shareReplay } from 'rxjs';

/** The session's CSRF token, fetched once and forgotten whenever the session changes. */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  // A client without interceptors, so fetching the token cannot recurse into the interceptor.
  private readonly http = new HttpClient(inject(HttpBackend));
  private token?: Observable<string>;

  get(): Observable<string> {
    this.token ??= this.http.get<{ csrfToken: string }>('/api/auth/csrf').pipe(
      map((r) => r.csrfToken),
      shareReplay(1),
    );
    return this.token;
  }

  forget(): void {
    this.token = undefined;
  }
}
