import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { apiErrorMessage } from '../../core/api-error';
import { CameraScanner } from '../../shared/camera-scanner';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { EmptyState } from '../../shared/empty-state';
import { FlightCaution } from '../flight-caution';
import { todayIn } from '../launch-calendar';
import type { CheckInAnswer, FlightView } from '@contracts/launches/launch-answers';
import type { FlightOutcome } from '@contracts/labels/launch-statuses';
import { LaunchesApi, OUTCOMES } from '../launches-api';

/** What the range officer is typing for one card: a send-back reason or an outcome. */
interface Draft {
  reason: string;
  outcome: FlightOutcome | null;
  notes: string;
}

/**
 * The range table on a phone: check members in with their card code (camera, scanner or pasted), then the cards by pad; approve or send back
 * with a reason, and record the outcome after the flight. Padside refuses to record a card beyond the flyer's
 * verified certification as cleared.
 */
@Component({
  selector: 'ps-range-table',
  imports: [
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    ClubDatePipe,
    EmptyState,
    FlightCaution,
    CameraScanner,
  ],
  templateUrl: './range-table.html',
  styleUrl: './range-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RangeTable {
  private readonly api = inject(LaunchesApi);
  readonly id = input<string>();

  private readonly all = rxResource({
    params: () => (this.id() ? undefined : true),
    stream: () => this.api.adminList(),
  });
  /** The launch shown: the one in the address, else today's or the next one on the calendar. */
  protected readonly launchId = computed<number | null>(() => {
    if (this.id()) return Number(this.id());
    const list = this.all.value();
    if (!list) return null;
    const today = todayIn(list.timeZone);
    return list.items.find((l) => l.status === 'scheduled' && l.date >= today)?.id ?? null;
  });
  protected readonly queue = rxResource({
    params: () => this.launchId() ?? undefined,
    stream: ({ params }) => this.api.queue(params),
  });
  protected readonly noLaunch = computed(() => !this.id() && this.all.hasValue() && this.launchId() === null);
  protected readonly outcomes = OUTCOMES;

  protected readonly token = signal('');
  protected readonly checkInAnswer = signal<CheckInAnswer | null>(null);
  protected readonly checkInProblem = signal<string | null>(null);
  protected readonly drafts = signal<Record<number, Draft>>({});
  protected readonly problems = signal<Record<number, string>>({});

  protected draft(id: number): Draft {
    return this.drafts()[id] ?? { reason: '', outcome: null, notes: '' };
  }

  protected edit(id: number, patch: Partial<Draft>): void {
    this.drafts.update((d) => ({ ...d, [id]: { ...this.draft(id), ...patch } }));
  }

  /** A code read by the camera is checked in at once. */
  protected scanned(token: string): Promise<void> {
    this.token.set(token);
    return this.checkIn();
  }

  protected async checkIn(): Promise<void> {
    const id = this.launchId();
    if (!id || !this.token().trim()) {
      this.checkInProblem.set('Scan or paste the member card code.');
      return;
    }
    this.checkInProblem.set(null);
    this.checkInAnswer.set(null);
    try {
      this.checkInAnswer.set(await firstValueFrom(this.api.checkIn(id, this.token())));
      this.token.set('');
    } catch (err) {
      this.checkInProblem.set(apiErrorMessage(err));
    }
  }

  private async act(f: FlightView, call: () => Promise<unknown>): Promise<void> {
    this.problems.update((p) => ({ ...p, [f.id]: '' }));
    try {
      await call();
      this.queue.reload();
    } catch (err) {
      this.problems.update((p) => ({ ...p, [f.id]: apiErrorMessage(err) }));
    }
  }

  protected approve(f: FlightView): Promise<void> {
    return this.act(f, () => firstValueFrom(this.api.decide(f.id, true)));
  }

  protected sendBack(f: FlightView): Promise<void> {
    return this.act(f, () => firstValueFrom(this.api.decide(f.id, false, this.draft(f.id).reason)));
  }

  protected recordOutcome(f: FlightView): Promise<void> {
    const d = this.draft(f.id);
    if (!d.outcome) {
      this.problems.update((p) => ({ ...p, [f.id]: 'Choose how the flight ended.' }));
      return Promise.resolve();
    }
    return this.act(f, () => firstValueFrom(this.api.outcome(f.id, d.outcome!, d.notes || undefined)));
  }
}
