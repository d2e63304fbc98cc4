import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';

/** The home page: what Padside is for, and the way into each part. */
@Component({
  selector: 'ps-storefront',
  imports: [RouterLink, MatButtonModule],
  template: `
    <section class="hero">
      <div class="ps-page">
        <h1>Printed, flown, filmed.</h1>
        <p>Season merch in limited runs, club dues, and the build logs our sponsors make possible.</p>
        <a mat-flat-button routerLink="/shop">See the merch</a>
        <a mat-stroked-button routerLink="/membership">Pay club dues</a>
      </div>
    </section>
  `,
  styles: `.hero { background: linear-gradient(160deg, var(--ps-night), #0e2536); color: #fff; } .hero h1 { font-size: clamp(2rem, 6vw, 3.5rem); margin: 0 0 8px; } .hero a { margin: 8px 8px 0 0; } .hero .ps-page { padding-top: 56px; padding-bottom: 56px; } .hero a[mat-stroked-button] { color: #fff; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Storefront {}
