import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormArray, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';
import { applyServerErrors } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { DELIVERABLE_KIND_LABELS as KIND_LABELS } from '@contracts/labels/deliverable-kinds';
import type { AdminSponsorRow } from '@contracts/sponsors/sponsor-answers';
import { SponsorAdminApi } from './sponsor-admin-api';
import { dollarsToCents } from '../../shared/dollars';

/** Sponsors at a glance: overdue promises first, the sortable list, a quick add form and the tier thresholds. */
@Component({
  selector: 'ps-sponsor-table',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSortModule,
    MatTableModule,
    ClubDatePipe,
    EmptyState,
    FieldErrorPipe,
    MoneyPipe,
  ],
  templateUrl: './sponsor-table.html',
  styles: `
    .wide {
      max-width: none;
    }
    table {
      width: 100%;
    }
    .card {
      background: #fff;
      border-radius: 12px;
      padding: 8px 16px;
      margin: 16px 0;
    }
    .overdue {
      border-left: 6px solid var(--mat-sys-error);
    }
    .inline {
      display: flex;
      gap: 12px;
      flex-wrap: wrap;
      align-items: baseline;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SponsorTable {
  private readonly api = inject(SponsorAdminApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly session = inject(SessionStore);

  protected readonly labels: Record<string, string> = KIND_LABELS;
  // Editors are not sent season totals, so they get no money column.
  protected readonly columns = computed(() =>
    this.session.hasAnyRole(['treasurer', 'admin']) ? ['name', 'tier', 'seasonTotalCents'] : ['name', 'tier'],
  );
  protected readonly sponsors = rxResource({ stream: () => this.api.list() });
  protected readonly overdue = rxResource({ stream: () => this.api.overdue() });
  protected readonly tiers = rxResource({ stream: () => this.api.tiers() });
  protected readonly sortState = signal<Sort>({ active: 'name', direction: 'asc' });
  protected readonly rows = computed(() => {
    const items = [...(this.sponsors.value()?.items ?? [])];
    const { active, direction } = this.sortState();
    const key = active as keyof AdminSponsorRow;
    const sign = direction === 'desc' ? -1 : 1;
    return items.sort(
      (a, b) => sign * String(a[key] ?? '').localeCompare(String(b[key] ?? ''), 'en', { numeric: true }),
    );
  });

  protected readonly form = this.fb.group({ name: ['', Validators.required], website: [''], blurb: [''] });
  protected readonly problem = signal<string | null>(null);
  protected readonly tierForm = this.fb.group({ tiers: this.fb.array<ReturnType<SponsorTable['tierRow']>>([]) });
  protected readonly tierProblem = signal<string | null>(null);

  protected get tierRows(): FormArray {
    return this.tierForm.controls.tiers;
  }

  protected editTiers(): void {
    this.tierRows.clear();
    for (const t of this.tiers.value()?.tiers ?? []) this.tierRows.push(this.tierRow(t.name, t.minCents / 100));
  }

  protected addTier(): void {
    this.tierRows.push(this.tierRow('', 0));
  }

  protected async saveTiers(): Promise<void> {
    this.tierProblem.set(null);
    try {
      await firstValueFrom(
        this.api.setTiers(
          this.tierRows
            .getRawValue()
            .map((t: { name: string; dollars: number }) => ({ name: t.name, minCents: dollarsToCents(t.dollars) })),
        ),
      );
      this.tierRows.clear();
      this.tiers.reload();
      this.sponsors.reload();
    } catch (err) {
      this.tierProblem.set(applyServerErrors(this.tierForm, err));
    }
  }

  protected async create(): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    this.problem.set(null);
    try {
      const res = await firstValueFrom(this.api.create(this.form.getRawValue()));
      this.snackBar.open('Sponsor added.', undefined, { duration: 3000 });
      await this.router.navigate(['/console/sponsors', res.id]);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
    }
  }

  private tierRow(name: string, dollars: number) {
    return this.fb.group({
      name: [name, Validators.required],
      dollars: [dollars, [Validators.required, Validators.min(0)]],
    });
  }
}
