import { DatePipe } from '@angular/common';
import {
  ApplicationRef,
  ChangeDetectionStrategy,
  Component,
  type ComponentRef,
  DestroyRef,
  ElementRef,
  EnvironmentInjector,
  afterRenderEffect,
  computed,
  effect,
  createComponent,
  inject,
  input,
  type Type,
  untracked,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DomSanitizer, type SafeHtml } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { SessionStore } from '../core/session-store';
import { BuildLogApi } from './build-log-api';
import { HazardNotice } from './hazard-notice';
import { SiteNames } from '../core/site-names';
import { PageMeta, SHARE_IMAGE } from '../core/page-meta';
import { isNotFound, loadErrorStatus } from '../core/rendering/load-error-status';
import { postData } from '../core/structured-data';
import type { FlightEmbed } from '../flights/flight-embed';

/**
 * One build log; members-only bodies arrive as null for others, who see the summary and a prompt to join.
 * Flight markers in the body arrive as `<div class="ps-flight" data-flight="id">` placeholders, each replaced here by
 * that flight's chart and summary.
 */
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
  /** How wide the cover shows (the preload says the same). */
  protected readonly coverSizes = '(max-width: 840px) 100vw, 800px';

  protected readonly post = rxResource({
    params: () => this.slug(),
    stream: ({ params }) => this.api.get(params, this.session.signedIn()),
  });
  /** The API said there is no such post; any other failure is worth a retry. */
  protected readonly missing = computed(() => isNotFound(this.post.error()));
  /**
   * The server's one Markdown pipeline has already sanitized this with its allow-list (and the CSP forbids inline
   * script); Angular's own sanitizer would also strip the task-list checkboxes that allow-list keeps.
   */
  protected readonly body = computed<SafeHtml | null>(() => {
    // value() throws while the resource holds an error (an unknown address).
    const html = this.post.hasValue() ? this.post.value().html : null;
    return html ? this.dom.bypassSecurityTrustHtml(html) : null;
  });

  private readonly bodyElement = viewChild<ElementRef<HTMLElement>>('bodyElement');
  private readonly appRef = inject(ApplicationRef);
  private readonly environmentInjector = inject(EnvironmentInjector);
  /** The embeds made so far, by their placeholder element. */
  private readonly flightEmbeds = new Map<HTMLElement, ComponentRef<FlightEmbed>>();

  constructor() {
    const meta = inject(PageMeta);
    const answerLoadError = loadErrorStatus();
    effect(() => {
      answerLoadError(this.post.error());
      const p = this.post.hasValue() ? this.post.value() : undefined;
      if (!p) return;
      const path = `/build-logs/${p.slug}`;
      const cover = p.cover ?? (p.coverUrl ? { url: p.coverUrl } : null);
      const publisher = this.site.teamName() || 'Padside';
      meta.describe({
        title: p.title,
        description: p.summary,
        path,
        type: 'article',
        image: cover,
        preload: p.cover
          ? {
              href: p.cover.url,
              srcset: `${p.cover.thumbnailUrl} 480w, ${p.cover.url} ${p.cover.width}w`,
              sizes: this.coverSizes,
            }
          : null,
        data: postData(p, meta.absolute(path), meta.absolute(cover?.url ?? SHARE_IMAGE.url), publisher),
      });
    });
    // The server renders as a visitor: once the session says a member is here, a withheld body is fetched for them.
    effect(() => {
      if (this.session.signedIn() && untracked(() => this.post.hasValue() && this.post.value().html === null))
        this.post.reload();
    });
    // After each render of a new body: its placeholders are fresh elements, so the old embeds go and new ones come.
    afterRenderEffect(() => {
      this.body();
      void this.mountFlights(this.bodyElement()?.nativeElement);
    });
    inject(DestroyRef).onDestroy(() => void this.mountFlights(undefined));
  }

  /** The embed's code (and Chart.js) loads only for a post that has a flight in it, once a chart nears the screen. */
  private embedType: Promise<Type<FlightEmbed>> | null = null;
  /**
   * Placeholders waiting to near the screen. A chart below the fold then costs nothing while the page starts on a
   * phone; the margin gives its code time to arrive before it scrolls in. Without the observer (a test's DOM) every
   * placeholder counts as near.
   */
  private nearScreen: IntersectionObserver | null = null;

  private async mountFlights(container: HTMLElement | undefined): Promise<void> {
    const placeholders = container
      ? Array.from(container.querySelectorAll<HTMLElement>('.ps-flight[data-flight]'))
      : [];
    for (const [element, ref] of this.flightEmbeds) {
      if (placeholders.includes(element)) continue;
      ref.destroy();
      this.flightEmbeds.delete(element);
    }
    const fresh = placeholders.filter(
      (p) => !this.flightEmbeds.has(p) && /^[1-9][0-9]*$/.test(p.dataset['flight'] ?? ''),
    );
    // Watches exactly the current body's placeholders still to be made; ones a new body replaced are let go.
    this.nearScreen?.disconnect();
    if (fresh.length === 0) return;
    if (typeof IntersectionObserver === 'undefined') return this.mountNear(fresh);
    this.nearScreen ??= new IntersectionObserver(
      (entries) => {
        const near = entries.filter((e) => e.isIntersecting).map((e) => e.target as HTMLElement);
        for (const element of near) this.nearScreen?.unobserve(element);
        void this.mountNear(near);
      },
      { rootMargin: '600px 0px' },
    );
    for (const placeholder of fresh) this.nearScreen.observe(placeholder);
  }

  private async mountNear(placeholders: HTMLElement[]): Promise<void> {
    if (placeholders.length === 0) return;
    const embed = await (this.embedType ??= import('../flights/flight-embed').then((m) => m.FlightEmbed));
    for (const placeholder of placeholders) {
      // The body may have changed while the code loaded.
      if (!placeholder.isConnected || this.flightEmbeds.has(placeholder)) continue;
      const ref = createComponent(embed, { environmentInjector: this.environmentInjector, hostElement: placeholder });
      ref.setInput('flightId', Number(placeholder.dataset['flight']));
      this.appRef.attachView(ref.hostView);
      this.flightEmbeds.set(placeholder, ref);
    }
  }
}
