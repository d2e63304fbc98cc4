import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  FormsModule,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { applyServerErrors } from '../../core/api-error';
import { MembershipApi } from '../../membership/membership-api';
import { MEMBERSHIP_STATUS_LABELS } from '@contracts/labels/membership-statuses';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { LabelPipe } from '../../shared/label-pipe';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import type { RosterFormQuery, RosterMailPurpose, RosterSortKey } from '@contracts/membership/roster-schemas';
import { MembersApi, filterParams } from './members-api';

const FIRST: RosterFormQuery = {
  status: '',
  planId: '',
  certificationLevel: '',
  associationExpiresBefore: '',
  q: '',
  sort: 'memberNumber',
  dir: 'asc',
  page: 1,
  pageSize: 25,
};

/** The roster: filters, search, server-side sort and paging, CSV export and an e-mail to the filtered list. */
@Component({
  selector: 'ps-roster',
  imports: [
    FormsModule,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatPaginatorModule,
    MatRadioModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    ClubDatePipe,
    LabelPipe,
    EmptyState,
    FieldErrorPipe,
  ],
  templateUrl: './roster.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Roster {
  private readonly api = inject(MembersApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly membership = inject(MembershipApi);

  protected readonly columns = [
    'memberNumber',
    'name',
    'plan',
    'status',
    'termEnd',
    'certificationLevel',
    'associationExpires',
  ];
  protected readonly statuses = ['active', 'lapsing', 'lapsed', 'pending'] as const;
  protected readonly statusLabels = MEMBERSHIP_STATUS_LABELS;
  protected readonly query = signal<RosterFormQuery>(FIRST);
  protected readonly roster = rxResource({
    params: () => this.query(),
    stream: ({ params }) => this.api.roster(params),
  });
  protected readonly plans = rxResource({ stream: () => this.membership.plans() });
  protected readonly policy = rxResource({ stream: () => this.membership.policy() });
  protected readonly csvUrl = computed(() => {
    const { page: _p, pageSize: _s, ...filters } = this.query();
    return `/api/admin/members/export.csv?${filterParams(filters).toString()}`;
  });

  protected readonly mailForm = this.fb.group({
    purpose: ['news' as RosterMailPurpose],
    subject: ['', [Validators.required, Validators.maxLength(200)]],
    text: ['', Validators.required],
  });
  protected readonly mailOpen = signal(false);
  protected readonly mailResult = signal<string | null>(null);
  protected readonly mailProblem = signal<string | null>(null);

  protected set<K extends keyof RosterFormQuery>(key: K, value: RosterFormQuery[K]): void {
    this.query.update((q) => ({ ...q, [key]: value, page: 1 }));
  }

  protected clear(): void {
    this.query.set(FIRST);
  }

  protected sortBy(s: Sort): void {
    this.query.update((q) => ({
      ...q,
      sort: (s.direction ? s.active : 'memberNumber') as RosterSortKey,
      dir: s.direction || 'asc',
      page: 1,
    }));
  }

  protected changePage(e: PageEvent): void {
    this.query.update((q) => ({ ...q, page: e.pageIndex + 1, pageSize: e.pageSize }));
  }

  protected async sendMail(formDir: FormGroupDirective): Promise<void> {
    this.mailForm.markAllAsTouched();
    if (this.mailForm.invalid) return;
    this.mailProblem.set(null);
    const { page: _p, pageSize: _s, ...filters } = this.query();
    try {
      const v = this.mailForm.getRawValue();
      const r = await firstValueFrom(this.api.emailRoster(filters, v.subject, v.text, v.purpose));
      this.mailResult.set(
        v.purpose === 'news'
          ? `Queued ${r.queued} e-mail(s). Skipped: ${r.skippedOptedOut} turned off news, ${r.skippedLapsedConsent} left the club more than two years ago, ${r.skippedSuppressed} stopped club news or bounced.`
          : `Queued ${r.queued} club-business e-mail(s).`,
      );
      formDir.resetForm({ purpose: 'news', subject: '', text: '' });
      this.mailOpen.set(false);
    } catch (err) {
      this.mailProblem.set(applyServerErrors(this.mailForm, err));
    }
  }
}
