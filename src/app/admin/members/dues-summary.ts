import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { apiErrorMessage } from '../../core/api-error';
import { EmptyState } from '../../shared/empty-state';
import { MoneyPipe } from '../../shared/money-pipe';
import { ClubRulesForm } from './club-rules-form';
import { MembersApi } from './members-api';

/** Dues collected per month and plan, members by status, and the plans with their dues (editable). */
@Component({
  selector: 'ps-dues-summary',
  imports: [ClubRulesForm, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, EmptyState, MoneyPipe],
  templateUrl: './dues-summary.html',
  styleUrl: './members.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DuesSummary {
  private readonly api = inject(MembersApi);
  protected readonly summary = rxResource({ stream: () => this.api.summary() });
  protected readonly plans = rxResource({ stream: () => this.api.plans() });
  protected readonly statuses = ['active', 'lapsing', 'lapsed', 'pending'] as const;
  protected readonly total = computed(() => (this.summary.value()?.collected ?? []).reduce((sum, r) => sum + r.cents, 0));
  protected readonly planProblem = signal<Record<number, string>>({});

  protected async saveDues(id: number, dollars: string): Promise<void> {
    const cents = Math.round(Number(dollars) * 100);
    if (!/^\d+(\.\d{1,2})?$/.test(dollars.trim())) {
      this.planProblem.update((p) => ({ ...p, [id]: 'Enter dollars and cents, e.g. 45.00.' }));
      return;
    }
    try {
      await firstValueFrom(this.api.updatePlan(id, { duesCents: cents }));
      this.planProblem.update((p) => ({ ...p, [id]: '' }));
      this.plans.reload();
    } catch (err) {
      this.planProblem.update((p) => ({ ...p, [id]: apiErrorMessage(err) }));
    }
  }

  protected print(): void {
    window.print();
  }
}
