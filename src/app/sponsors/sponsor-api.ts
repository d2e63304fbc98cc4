import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { QUIET_ERRORS } from '../core/error-interceptor';
import type { PortalView, SponsorWall } from '@contracts/sponsors/sponsor-answers';

/** The public sponsors page and the sponsor's own portal. */
@Injectable({ providedIn: 'root' })
export class SponsorApi {
  private readonly http = inject(HttpClient);

  /** The public sponsors page: this season's sponsors by tier. */
  wall(): Observable<SponsorWall> {
    return this.http.get<SponsorWall>('/api/sponsors/wall');
  }

  /** Quiet: a sponsor account not linked yet gets a message on the page, not a snack bar. */
  portal(): Observable<PortalView> {
    return this.http.get<PortalView>('/api/sponsor-portal/me', { context: new HttpContext().set(QUIET_ERRORS, true) });
  }
}
