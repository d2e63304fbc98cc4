import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MEMBERSHIP_STATUS_LABELS } from '@contracts/labels/membership-statuses';
import { EmptyState } from '../../shared/empty-state';
import { MoneyPipe } from '../../shared/money-pipe';
import { ClubRulesForm } from './club-rules-form';
import { MembersApi } from './members-api';
import { PlanList } from './plan-list';

/** Dues collected per month and plan, members by status, the plans (editable) and the club rules. */
@Component({
  selector: 'ps-dues-summary',
  imports: [ClubRulesForm, PlanList, RouterLink, MatButtonModule, EmptyState, MoneyPipe],
  templateUrl: './dues-summary.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DuesSummary {
  private readonly api = inject(MembersApi);
  protected readonly summary = rxResource({ stream: () => this.api.summary() });
  protected readonly statuses = ['active', 'lapsing', 'lapsed', 'pending'] as const;
  protected readonly statusLabels = MEMBERSHIP_STATUS_LABELS;
  protected readonly total = computed(() =>
    (this.summary.value()?.collected ?? []).reduce((sum, r) => sum + r.cents, 0),
  );

  protected print(): void {
    window.print();
  }
}
