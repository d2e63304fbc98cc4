import { ChangeDetectionStrategy, Component, effect, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { SiteNames } from '../core/site-names';
import { EmptyState } from '../shared/empty-state';
import { SponsorApi } from './sponsor-api';
import { PageMeta } from '../core/page-meta';
import { loadErrorStatus } from '../core/rendering/load-error-status';

/** The public thank-you page: this season's sponsors grouped by tier, each with the build logs that credit it. */
@Component({
  selector: 'ps-sponsor-wall',
  imports: [RouterLink, MatButtonModule, EmptyState],
  template: `
    <section class="ps-page">
      <h1>Our sponsors</h1>
      <p class="form-note">{{ site.teamName() }} fly because these businesses back us with cash, parts and know-how.</p>
      @if (wall.error()) {
        <p class="form-problem" role="alert">The sponsors could not be loaded just now.</p>
        <button mat-flat-button type="button" (click)="wall.reload()" [disabled]="wall.isLoading()">Try again</button>
      } @else if (wall.value(); as w) {
        @for (tier of w.tiers; track tier.name) {
          <section class="tier" [attr.aria-labelledby]="'tier-' + $index">
            <h2 [id]="'tier-' + $index">
              {{ tier.name }} <span class="season">· {{ w.season }} season</span>
            </h2>
            <ul class="cards" role="list">
              @for (s of tier.sponsors; track s.id) {
                <li class="card" [id]="s.slug">
                  @if (s.logoUrl) {
                    <!-- The stored size keeps the logo's box before it loads (no layout shift); without one, the largest box .logo allows. -->
                    <img
                      [src]="s.logoUrl"
                      [alt]="s.name + ' logo'"
                      class="logo"
                      [width]="s.logoSize?.width ?? 160"
                      [height]="s.logoSize?.height ?? 80"
                    />
                  }
                  <h3>{{ s.name }}</h3>
                  @if (s.blurb) {
                    <p>{{ s.blurb }}</p>
                  }
                  @if (s.website) {
                    <p>
                      <a [href]="s.website" rel="noopener noreferrer" target="_blank">Visit {{ s.name }}</a>
                    </p>
                  }
                  @if (s.posts.length) {
                    <p class="credited">Credited in:</p>
                    <ul>
                      @for (p of s.posts; track p.slug) {
                        <li>
                          <a [routerLink]="['/build-logs', p.slug]">{{ p.title }}</a>
                        </li>
                      }
                    </ul>
                  }
                </li>
              }
            </ul>
          </section>
        } @empty {
          <ps-empty-state icon="handshake" message="No sponsors this season yet." />
        }
      }
    </section>
  `,
  styles: `
    .tier {
      margin-top: 24px;
    }
    .season {
      font-weight: 400;
      font-size: 0.9rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .cards {
      list-style: none;
      padding: 0;
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(260px, 1fr));
      gap: 16px;
    }
    .card {
      background: #fff;
      border-radius: 12px;
      padding: 16px;
      border-top: 4px solid var(--ps-igniter);
    }
    .logo {
      max-width: 160px;
      max-height: 80px;
      object-fit: contain;
    }
    h3 {
      margin: 4px 0;
    }
    .credited {
      font-weight: 600;
      margin-bottom: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SponsorWall {
  constructor() {
    inject(PageMeta).describe({
      title: 'Sponsors',
      description: 'The businesses that back the team with cash, parts and know-how this season.',
      path: '/sponsors',
      type: 'website',
    });
    const answerLoadError = loadErrorStatus();
    effect(() => answerLoadError(this.wall.error()));
  }

  private readonly api = inject(SponsorApi);
  protected readonly site = inject(SiteNames);
  protected readonly wall = rxResource({ stream: () => this.api.wall() });
}
