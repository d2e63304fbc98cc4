import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { SignUpForm } from '../announcements/sign-up-form';
import { timeLeft } from './countdown';
import { ShopApi } from './shop-api';
import { PageMeta } from '../core/page-meta';

/** The home page: what Padside is for, the way into each part, and the run that is open now. */
@Component({
  selector: 'ps-storefront',
  imports: [RouterLink, MatButtonModule, SignUpForm],
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
        @if (p.images[0]; as img) {
          <img
            class="photo"
            [src]="img.thumbnailUrl"
            [attr.srcset]="img.thumbnailUrl + ' 480w, ' + img.url + ' ' + (img.width ?? 1200) + 'w'"
            sizes="(max-width: 600px) 100vw, 320px"
            [alt]="img.alt"
            [attr.width]="img.width ?? 1200"
            [attr.height]="img.height ?? 1200"
            fetchpriority="high"
          />
        }
        <div>
          <h2>On the rail now: {{ p.name }}</h2>
          <p>
            {{ p.run!.remaining }} of {{ p.run!.cap }} left · {{ left(p.run!.closesAt) }}. Printed once the window
            closes.
          </p>
          <a mat-flat-button [routerLink]="['/shop/p', p.slug]">Order yours</a>
        </div>
      </section>
    }
    <section class="ps-page">
      <!-- Made in the browser once its place nears the screen: the server's page carries no form fields' styles. -->
      @defer (on viewport) {
        <ps-sign-up-form page="home" heading="Tell me about new runs, launch days and build logs" />
      } @placeholder {
        <div class="sign-up-slot" data-testid="sign-up-slot"></div>
      }
    </section>
  `,
  styles: `
    .hero {
      background: linear-gradient(160deg, var(--ps-night), #0e2536);
      color: #fff;
    }
    .hero h1 {
      font-size: clamp(2rem, 6vw, 3.5rem);
      margin: 0 0 8px;
    }
    .hero a {
      margin: 8px 8px 0 0;
    }
    .hero .ps-page {
      padding-top: 56px;
      padding-bottom: 56px;
    }
    .hero a[mat-stroked-button] {
      color: #fff;
    }
    .now {
      display: flex;
      gap: 24px;
      align-items: center;
      flex-wrap: wrap;
    }
    .now h2 {
      margin-bottom: 4px;
    }
    .sign-up-slot {
      min-height: 220px;
    }
    .photo {
      width: min(320px, 100%);
      height: auto;
      border-radius: 14px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Storefront {
  constructor() {
    inject(PageMeta).describe({
      title: 'Merch, club dues and build logs',
      description: 'Season merch in limited runs, club dues, and the build logs our sponsors make possible.',
      path: '/',
      type: 'website',
    });
  }

  private readonly api = inject(ShopApi);
  private readonly products = rxResource({ stream: () => this.api.products() });
  /** The open run to show, one with photos first. */
  protected readonly openRun = computed(() => {
    const open = (this.products.value() ?? []).filter((p) => p.run?.state === 'open');
    return open.find((p) => p.images.length) ?? open[0] ?? null;
  });

  protected left(closesAt: string): string {
    return timeLeft(closesAt, Date.now());
  }
}
