import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'ps-no-access',
  imports: [RouterLink],
  template: `
    <section class="ps-narrow">
      <h1>Not with this account</h1>
      <p>Your account does not include that area. If you think it should, ask the club's admin to add the role.</p>
      <a routerLink="/">Back to the storefront</a>
    </section>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoAccess {}
