import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { apiErrorMessage } from '../core/api-error';
import { MoneyPipe } from '../shared/money-pipe';
import { EmptyState } from '../shared/empty-state';
import { DELIVERABLE_KIND_LABELS as KIND_LABELS } from '@contracts/labels/deliverable-kinds';
import { SponsorApi } from './sponsor-api';

/** The sponsor's own view: agreements with promised vs delivered, every credit with its link, and report downloads. */
@Component({
  selector: 'ps-sponsor-portal',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatTableModule, MoneyPipe, EmptyState],
  templateUrl: './sponsor-portal.html',
  styleUrl: './sponsor-portal.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SponsorPortal {
  private readonly api = inject(SponsorApi);
  protected readonly labels: Record<string, string> = KIND_LABELS;
  protected readonly view = rxResource({ stream: () => this.api.portal() });
  protected readonly problem = computed(() => (this.view.error() ? apiErrorMessage(this.view.error()) : null));
  protected readonly creditColumns = ['at', 'kind', 'what'];
  protected readonly lineColumns = ['kind', 'progress', 'dueOn', 'state'];
}
