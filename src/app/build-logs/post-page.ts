import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DomSanitizer, type SafeHtml } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { SessionStore } from '../core/session-store';
import { BuildLogApi } from './build-log-api';
import { HazardNotice } from './hazard-notice';
import { SiteNames } from '../core/site-names';

/** One build log; members-only bodies arrive as null for others, who see the summary and a prompt to join. */
@Component({
  selector: 'ps-post-page',
  imports: [DatePipe, RouterLink, MatButtonModule, HazardNotice],
  templateUrl: './post-page.html',
  styleUrl: './post-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PostPage {
  private readonly api = inject(BuildLogApi);
  private readonly dom = inject(DomSanitizer);
  protected readonly session = inject(SessionStore);
  protected readonly site = inject(SiteNames);

  readonly slug = input.required<string>();

  protected readonly post = rxResource({ params: () => this.slug(), stream: ({ params }) => this.api.get(params) });
  /**
   * The server's one Markdown pipeline has already sanitized this with its allow-list (and the CSP forbids inline
   * script); Angular's own sanitizer would also strip the task-list checkboxes that allow-list keeps.
   */
  protected readonly body = computed<SafeHtml | null>(() => {
    // value() throws while the resource holds an error (an unknown address).
    const html = this.post.hasValue() ? this.post.value().html : null;
    return html ? this.dom.bypassSecurityTrustHtml(html) : null;
  });
}
