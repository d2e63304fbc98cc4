import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { SiteNames } from '../core/site-names';
import { EmptyState } from '../shared/empty-state';
import { BuildLogApi } from './build-log-api';
import { PageMeta } from '../core/page-meta';
import { loadErrorStatus } from '../core/rendering/load-error-status';

const PAGE_SIZE = 10;

/** Published build logs, newest first, filtered by tag through the URL (?tag=&page=) so a filtered list can be shared. */
@Component({
  selector: 'ps-post-list',
  imports: [RouterLink, DatePipe, MatButtonModule, MatIconModule, MatPaginatorModule, EmptyState],
  templateUrl: './post-list.html',
  styleUrl: './post-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PostList {
  constructor() {
    inject(PageMeta).describe({
      title: 'Build logs',
      description: 'How the rockets, altimeters and videos are made, step by step.',
      path: '/build-logs',
      type: 'website',
    });
    const answerLoadError = loadErrorStatus();
    effect(() => answerLoadError(this.posts.error()));
  }

  private readonly api = inject(BuildLogApi);
  private readonly router = inject(Router);
  protected readonly site = inject(SiteNames);

  readonly tag = input<string>();
  readonly page = input<string>();

  protected readonly pageSize = PAGE_SIZE;
  protected readonly pageNumber = computed(() => Math.max(1, Number(this.page()) || 1));
  protected readonly posts = rxResource({
    params: () => ({ tag: this.tag() || undefined, page: this.pageNumber(), pageSize: PAGE_SIZE }),
    stream: ({ params }) => this.api.list(params),
  });
  protected readonly tags = rxResource({ stream: () => this.api.tags() });

  protected changePage(e: PageEvent): void {
    void this.router.navigate([], { queryParams: { page: e.pageIndex + 1 }, queryParamsHandling: 'merge' });
  }
}
