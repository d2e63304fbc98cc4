import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { DELIVERABLE_KIND_LABELS as KIND_LABELS } from '@contracts/labels/deliverable-kinds';
import { PostAdminApi } from '../posts/post-admin-api';
import { SponsorAdminApi } from '../sponsors/sponsor-admin-api';

/** How many titles a tile lists before "and N more". */
const SHOWN = 3;

/** The editor's part of the overview: drafts to finish, posts waiting for their time, sponsor credits owed. */
@Component({
  selector: 'ps-editor-overview',
  imports: [RouterLink, DatePipe],
  templateUrl: './editor-overview.html',
  styleUrl: './dashboard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EditorOverview {
  private readonly posts = inject(PostAdminApi);
  private readonly sponsors = inject(SponsorAdminApi);
  protected readonly shown = SHOWN;
  protected readonly kinds = KIND_LABELS;
  protected readonly drafts = rxResource({
    stream: () => this.posts.list({ status: 'draft', sort: 'updated', dir: 'desc', page: 1, pageSize: SHOWN }),
  });
  protected readonly scheduled = rxResource({
    stream: () => this.posts.list({ status: 'scheduled', sort: 'updated', dir: 'desc', page: 1, pageSize: SHOWN }),
  });
  protected readonly overdue = rxResource({ stream: () => this.sponsors.overdue() });
}
