import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatToolbarModule } from '@angular/material/toolbar';
import { SessionStore } from '../session-store';
import { SiteNames } from '../site-names';
import { CartStore } from '../../shop/cart-store';
import { AccountMenu } from './account-menu';

/** Public sections in the top bar. */
const SECTIONS: { path: string; label: string; exact?: boolean }[] = [
  { path: '/shop', label: 'Merch' },
  { path: '/membership', label: 'Club dues' },
  { path: '/build-logs', label: 'Build logs' },
  { path: '/launches', label: 'Launch days' },
  // Exact, so the public page is not marked current inside the sponsor portal (/sponsors/portal).
  { path: '/sponsors', label: 'Sponsors', exact: true },
];

/** Padside's frame: top bar with the mark, sections and the account menu; footer with the flying caution. */
@Component({
  selector: 'ps-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule, AccountMenu],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);
  protected readonly cart = inject(CartStore);

  protected readonly sections = SECTIONS;
  protected readonly menuOpen = signal(false);

  protected toggleMenu(): void {
    this.menuOpen.update((open) => !open);
  }
}
