import { ChangeDetectionStrategy, Component, RESPONSE_INIT, inject } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';

/** Any address the app has no page for, also a detail page whose id or slug could never exist: answered 404. */
@Component({
  selector: 'ps-not-found',
  imports: [RouterLink, MatButtonModule],
  template: `
    <section class="ps-narrow">
      <h1>Off the pad</h1>
      <p>We could not find that page. It may have moved, or the link may be mistyped.</p>
      <a mat-flat-button routerLink="/">Back to the storefront</a>
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {
  constructor() {
    // The server route may have matched a detail page (`launches/:id`) whose guard then refused the id.
    const response = inject(RESPONSE_INIT, { optional: true });
    if (response) response.status = 404;
  }
}
