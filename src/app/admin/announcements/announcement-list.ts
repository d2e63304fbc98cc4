import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { EmptyState } from '../../shared/empty-state';
import { AnnouncementAdminApi } from './announcement-admin-api';
import type { AnnouncementQuery } from '@contracts/announcements/announcement-schemas';
import { SenderSettings } from './sender-settings';

/** Every announcement and drop notice with its status and delivery counts, sorted and paged by the server. */
@Component({
  selector: 'ps-announcement-list',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatPaginatorModule,
    MatSortModule,
    MatTableModule,
    EmptyState,
    SenderSettings,
  ],
  template: `
    <section class="ps-page wide">
      <div class="top">
        <h1>Announcements</h1>
        <a mat-flat-button routerLink="/console/announcements/new">Write an announcement</a>
      </div>
      <p>
        Mail goes only to people who asked for the list (or bought or joined within the last two years) and not to
        addresses on the suppression list.
      </p>
      @if (list.value(); as page) {
        @if (page.items.length) {
          <div class="scroll">
            <table
              mat-table
              [dataSource]="page.items"
              matSort
              [matSortActive]="query().sort"
              [matSortDirection]="query().dir"
              (matSortChange)="sort($event)"
            >
              <caption class="ps-visually-hidden">
                Announcements, sortable by subject, list and date
              </caption>
              <ng-container matColumnDef="subject">
                <th mat-header-cell *matHeaderCellDef mat-sort-header="subject" scope="col">Subject</th>
                <td mat-cell *matCellDef="let a">
                  <a [routerLink]="['/console/announcements', a.id]">{{ a.subject }}</a>
                  @if (a.kind === 'drop_notice') {
                    <span class="kind"> · automatic drop notice</span>
                  }
                </td>
              </ng-container>
              <ng-container matColumnDef="topic">
                <th mat-header-cell *matHeaderCellDef mat-sort-header="topic" scope="col">List</th>
                <td mat-cell *matCellDef="let a">{{ a.topic }}</td>
              </ng-container>
              <ng-container matColumnDef="status">
                <th mat-header-cell *matHeaderCellDef scope="col">Status</th>
                <td mat-cell *matCellDef="let a">{{ statusLabel[a.status] }}</td>
              </ng-container>
              <ng-container matColumnDef="counts">
                <th mat-header-cell *matHeaderCellDef scope="col">Sent / recipients</th>
                <td mat-cell *matCellDef="let a">
                  {{ a.counts.sent }} / {{ a.counts.recipients }}
                  @if (a.counts.failed) {
                    · {{ a.counts.failed }} failed
                  }
                </td>
              </ng-container>
              <ng-container matColumnDef="created">
                <th mat-header-cell *matHeaderCellDef mat-sort-header="created" scope="col">Written</th>
                <td mat-cell *matCellDef="let a">{{ a.createdAt | date: 'medium' }}</td>
              </ng-container>
              <tr mat-header-row *matHeaderRowDef="columns"></tr>
              <tr mat-row *matRowDef="let row; columns: columns"></tr>
            </table>
          </div>
          <mat-paginator
            [length]="page.total"
            [pageIndex]="query().page - 1"
            [pageSize]="query().pageSize"
            [pageSizeOptions]="[25, 50, 100]"
            (page)="changePage($event)"
            aria-label="Pages of announcements"
          />
        } @else {
          <ps-empty-state icon="campaign" message="No announcement yet." />
        }
      }
      <ps-sender-settings />
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
      gap: 8px;
      flex-wrap: wrap;
    }
    .scroll {
      overflow-x: auto;
    }
    table {
      width: 100%;
    }
    .kind {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnnouncementList {
  private readonly api = inject(AnnouncementAdminApi);
  protected readonly columns = ['subject', 'topic', 'status', 'counts', 'created'];
  protected readonly statusLabel: Record<string, string> = { draft: 'Draft', sending: 'Sending', sent: 'Sent' };
  protected readonly query = signal<AnnouncementQuery>({ page: 1, pageSize: 25, sort: 'created', dir: 'desc' });
  protected readonly list = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });

  protected sort(s: Sort): void {
    this.query.update((v) => ({
      ...v,
      sort: (s.active as AnnouncementQuery['sort']) || 'created',
      dir: s.direction || 'desc',
      page: 1,
    }));
  }

  protected changePage(e: PageEvent): void {
    this.query.update((v) => ({ ...v, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }
}
