import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DomSanitizer } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { FlyingCaution } from './flying-caution';
import { MembershipApi } from './membership-api';
import { SiteNames } from '../core/site-names';

/** The printable member card with the check-in QR code. */
@Component({
  selector: 'ps-member-card',
  imports: [RouterLink, MatButtonModule, FlyingCaution],
  templateUrl: './member-card.html',
  styleUrl: './member-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MemberCard {
  private readonly sanitizer = inject(DomSanitizer);
  private readonly api = inject(MembershipApi);
  protected readonly site = inject(SiteNames);
  protected readonly card = rxResource({ stream: () => this.api.card() });
  // The SVG is drawn by our own server from the signed token (paths only, no script), so it is trusted as is.
  protected readonly qr = computed(() => {
    const svg = this.card.value()?.card.qrSvg;
    return svg ? this.sanitizer.bypassSecurityTrustHtml(svg) : null;
  });

  protected print(): void {
    window.print();
  }
}
