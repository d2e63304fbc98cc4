import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';

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
export class NotFound {}
