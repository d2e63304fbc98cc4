import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { SessionStore } from '../core/session-store';
import { CONSOLE_LINKS } from './console-nav';

/** The staff console: side navigation (only the links the user's roles allow) and the page beside it. */
@Component({
  selector: 'ps-console-frame',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatSidenavModule, MatListModule, MatIconModule],
  template: `
    <mat-sidenav-container class="frame">
      <mat-sidenav [mode]="narrow() ? 'over' : 'side'" [opened]="!narrow()" #nav class="ps-no-print">
        <h2 class="title">Console</h2>
        <mat-nav-list aria-label="Console sections">
          @for (link of links(); track link.path) {
            @if (link.fullLoad) {
              <a
                mat-list-item
                [href]="link.path"
                [activated]="isCurrent(link.path)"
                [attr.aria-current]="isCurrent(link.path) ? 'page' : null"
              >
                <mat-icon matListItemIcon aria-hidden="true">{{ link.icon }}</mat-icon>
                <span matListItemTitle>{{ link.label }}</span>
              </a>
            } @else {
              <a
                mat-list-item
                [routerLink]="link.path"
                routerLinkActive
                #rla="routerLinkActive"
                [routerLinkActiveOptions]="{ exact: link.path === '/console' }"
                [activated]="rla.isActive"
                [attr.aria-current]="rla.isActive ? 'page' : null"
                (click)="narrow() && nav.close()"
              >
                <mat-icon matListItemIcon aria-hidden="true">{{ link.icon }}</mat-icon>
                <span matListItemTitle>{{ link.label }}</span>
              </a>
            }
          }
        </mat-nav-list>
      </mat-sidenav>
      <mat-sidenav-content>
        @if (narrow()) {
          <button type="button" class="open-nav ps-no-print" (click)="nav.open()">
            <mat-icon aria-hidden="true">menu_open</mat-icon> Console sections
          </button>
        }
        <router-outlet />
      </mat-sidenav-content>
    </mat-sidenav-container>
  `,
  styles: `
    .frame {
      min-height: calc(100vh - 64px);
      background: transparent;
    }
    mat-sidenav {
      width: 232px;
      background: #eef1f5;
    }
    .title {
      padding: 16px 16px 0;
      margin: 0;
      font-size: 1rem;
      text-transform: uppercase;
      letter-spacing: 0.08em;
      color: var(--ps-night);
    }
    .open-nav {
      display: inline-flex;
      gap: 4px;
      align-items: center;
      margin: 8px;
      background: none;
      border: 1px solid #99a;
      border-radius: 8px;
      padding: 6px 10px;
      font: inherit;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConsoleFrame {
  private readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 800px)')
      .pipe(map((s) => s.matches)),
    { initialValue: false },
  );
  protected readonly links = computed(() => {
    this.session.user();
    return CONSOLE_LINKS.filter((l) => this.session.hasAnyRole(l.roles));
  });

  /** A full-load link is current on its page and the pages under it (the range table of one launch day). */
  protected isCurrent(path: string): boolean {
    const url = this.router.url.split('?')[0];
    return url === path || url.startsWith(`${path}/`);
  }
}
