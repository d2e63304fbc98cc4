import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { timeLeft } from './countdown';
import { ShopApi } from './shop-api';

/** The home page: what Padside is for, the way into each part, and the run that is open now. */
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
    @if (openRun(); as p) {
      <section class="ps-page now">
        <h2>On the rail now: {{ p.name }}</h2>
        <p>{{ p.run!.remaining }} of {{ p.run!.cap }} left · {{ left(p.run!.closesAt) }}. Printed once the window closes.</p>
        <a mat-flat-button [routerLink]="['/shop/p', p.slug]">Order yours</a>
      </section>
    }
  `,
  styles: `.hero { background: linear-gradient(160deg, var(--ps-night), #0e2536); color: #fff; } .hero h1 { font-size: clamp(2rem, 6vw, 3.5rem); margin: 0 0 8px; } .hero a { margin: 8px 8px 0 0; } .hero .ps-page { padding-top: 56px; padding-bottom: 56px; } .hero a[mat-stroked-button] { color: #fff; } .now h2 { margin-bottom: 4px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Storefront {
  private readonly api = inject(ShopApi);
  private readonly products = rxResource({ stream: () => this.api.products() });
  protected readonly openRun = computed(() => this.products.value()?.find((p) => p.run?.state === 'open') ?? null);

  protected left(closesAt: string): string {
    return timeLeft(closesAt, Date.now());
  }
}
