import { ChangeDetectionStrategy, Component, inject, input, linkedSignal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { POST_STATUS_LABELS, POST_VISIBILITY_LABELS } from '@contracts/labels/post-states';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { LabelPipe } from '../../shared/label-pipe';
import type { PostStatus } from '@contracts/labels/post-states';
import { PostAdminApi } from './post-admin-api';

const STATUSES: readonly PostStatus[] = ['draft', 'scheduled', 'published'];

/** Every post for editors, sorted and paged by the server. */
@Component({
  selector: 'ps-post-table',
  imports: [
    ClubDatePipe,
    LabelPipe,
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatSortModule,
    MatTableModule,
    EmptyState,
  ],
  template: `
    <section class="ps-page wide">
      <div class="top">
        <h1>Build logs</h1>
        <a mat-flat-button routerLink="/console/posts/new">Write a build log</a>
      </div>
      <div class="filters">
        <mat-form-field>
          <mat-label>Search titles</mat-label>
          <input matInput type="search" [ngModel]="query().q" (ngModelChange)="set({ q: $event })" />
        </mat-form-field>
        <mat-button-toggle-group
          [value]="query().status ?? ''"
          (change)="set({ status: $event.value || undefined })"
          aria-label="Filter by status"
        >
          <mat-button-toggle value="">All</mat-button-toggle>
          <mat-button-toggle value="draft">Drafts</mat-button-toggle>
          <mat-button-toggle value="scheduled">Scheduled</mat-button-toggle>
          <mat-button-toggle value="published">Published</mat-button-toggle>
        </mat-button-toggle-group>
      </div>
      @if (posts.value(); as page) {
        @if (page.items.length) {
          <table
            mat-table
            [dataSource]="page.items"
            matSort
            [matSortActive]="query().sort"
            [matSortDirection]="query().dir"
            (matSortChange)="sort($event)"
          >
            <caption class="ps-visually-hidden">
              Build logs, sortable by title, publish date and last change
            </caption>
            <ng-container matColumnDef="title">
              <th mat-header-cell *matHeaderCellDef mat-sort-header="title" scope="col">Title</th>
              <td mat-cell *matCellDef="let p">
                <a [routerLink]="['/console/posts', p.id]">{{ p.title }}</a>
              </td>
            </ng-container>
            <ng-container matColumnDef="status">
              <th mat-header-cell *matHeaderCellDef scope="col">Status</th>
              <td mat-cell *matCellDef="let p">
                {{ p.status | label: statusLabels }}
                @if (p.status === 'scheduled') {
                  · {{ p.publishAt | clubDate: 'dateTime' }}
                }
                @if (p.membersOnly) {
                  · {{ visibilityLabels.members }}
                }
              </td>
            </ng-container>
            <ng-container matColumnDef="published">
              <th mat-header-cell *matHeaderCellDef mat-sort-header="published" scope="col">Published</th>
              <td mat-cell *matCellDef="let p">{{ p.publishedAt | clubDate }}</td>
            </ng-container>
            <ng-container matColumnDef="updated">
              <th mat-header-cell *matHeaderCellDef mat-sort-header="updated" scope="col">Last change</th>
              <td mat-cell *matCellDef="let p">{{ p.updatedAt | clubDate: 'dateTime' }}</td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
          </table>
          <mat-paginator
            [length]="page.total"
            [pageIndex]="query().page - 1"
            [pageSize]="query().pageSize"
            [pageSizeOptions]="[25, 50, 100]"
            (page)="changePage($event)"
            aria-label="Pages of build logs"
          />
        } @else {
          <ps-empty-state icon="edit_note" message="No build log matches." />
        }
      }
    </section>
  `,
  styles: `
    .wide {
      max-width: none;
    }
    .top {
      display: flex;
      justify-content: space-between;
      align-items: center;
    }
    .filters {
      display: flex;
      gap: 16px;
      align-items: center;
      flex-wrap: wrap;
    }
    table {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PostTable {
  private readonly api = inject(PostAdminApi);
  protected readonly columns = ['title', 'status', 'published', 'updated'];
  protected readonly statusLabels = POST_STATUS_LABELS;
  protected readonly visibilityLabels = POST_VISIBILITY_LABELS;
  /** `?status=draft` from a link (the overview's tiles); the toggle changes it from there. */
  readonly status = input<PostStatus | undefined>();
  protected readonly query = linkedSignal<{
    q: string;
    status?: PostStatus;
    sort: 'updated' | 'title' | 'published';
    dir: 'asc' | 'desc';
    page: number;
    pageSize: number;
  }>(() => ({
    q: '',
    status: STATUSES.find((x) => x === this.status()),
    sort: 'updated',
    dir: 'desc',
    page: 1,
    pageSize: 25,
  }));
  protected readonly posts = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });

  protected set(patch: { q?: string; status?: PostStatus }): void {
    this.query.update((v) => ({ ...v, ...patch, page: 1 }));
  }

  protected sort(s: Sort): void {
    this.query.update((v) => ({
      ...v,
      sort: (s.active as 'updated' | 'title' | 'published') || 'updated',
      dir: s.direction || 'desc',
      page: 1,
    }));
  }

  protected changePage(e: PageEvent): void {
    this.query.update((v) => ({ ...v, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }
}
