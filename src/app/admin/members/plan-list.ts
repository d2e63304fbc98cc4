import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { EmptyState } from '../../shared/empty-state';
import { MoneyPipe } from '../../shared/money-pipe';
import type { Plan } from '@contracts/membership/membership-answers';
import { ELIGIBILITY_LABELS, MembersApi } from './members-api';
import { PlanForm } from './plan-form';

/** The club's plans with dues, joining fee, who may hold them and whether they are offered; add or edit one. */
@Component({
  selector: 'ps-plan-list',
  imports: [MatButtonModule, EmptyState, MoneyPipe, PlanForm],
  templateUrl: './plan-list.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanList {
  private readonly api = inject(MembersApi);
  protected readonly plans = rxResource({ stream: () => this.api.plans() });
  protected readonly labels = ELIGIBILITY_LABELS;
  /** The plan in the form, `new` while adding one, null with the form closed. */
  protected readonly editing = signal<Plan | 'new' | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly nextSortOrder = computed(
    () => Math.max(0, ...(this.plans.value()?.items ?? []).map((p) => p.sortOrder)) + 1,
  );
  private opener: HTMLElement | null = null;

  protected open(target: Plan | 'new', event: Event): void {
    this.opener = event.currentTarget as HTMLElement;
    this.notice.set(null);
    this.editing.set(target);
  }

  protected saved(plan: Plan): void {
    this.notice.set(`Plan ${plan.name} saved.`);
    this.close();
    this.plans.reload();
  }

  /** Back to the button that opened the form, so keyboard users keep their place. */
  protected close(): void {
    this.editing.set(null);
    this.opener?.focus();
  }
}
