import { ChangeDetectionStrategy, Component, computed, effect, inject } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { map, of } from 'rxjs';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import type { AdminSponsorRow } from '@contracts/sponsors/sponsor-answers';
import { SponsorAdminApi } from '../sponsors/sponsor-admin-api';
import { creditMarker, openPromises, type OpenPromise } from './credit-marker';

/** The sponsors an editor may thank. */
export interface CreditDialogData {
  sponsors: readonly AdminSponsorRow[];
}

/**
 * Thanks a sponsor in the text: the editor picks the sponsor and which of their open build-log promises the post
 * counts against once published (the earliest due preselected, as the server would pick), writes an optional note,
 * and gets the credit line inserted for them.
 */
@Component({
  selector: 'ps-credit-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
    ClubDatePipe,
    FieldErrorPipe,
  ],
  templateUrl: './credit-dialog.html',
  styles: `
    .counted,
    .promise-choice {
      margin: 0 0 16px;
    }
    .promises {
      display: flex;
      flex-direction: column;
    }
    .promises-label {
      margin: 0 0 4px;
      font-weight: 500;
    }
    mat-form-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CreditDialog {
  private readonly api = inject(SponsorAdminApi);
  private readonly ref = inject<MatDialogRef<CreditDialog, string>>(MatDialogRef);
  protected readonly data = inject<CreditDialogData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    sponsorId: [0, Validators.min(1)],
    /** The chosen promise; 0 when the sponsor has none open (the marker then names none). */
    deliverableId: [0],
    note: ['', Validators.maxLength(200)],
  });
  private readonly sponsorId = toSignal(this.form.controls.sponsorId.valueChanges, { initialValue: 0 });
  /** The chosen sponsor's open build-log promises, earliest due first. */
  protected readonly promises = rxResource<OpenPromise[] | undefined, number>({
    params: () => this.sponsorId(),
    stream: ({ params }) =>
      params ? this.api.ledger(params).pipe(map((l) => openPromises(l.agreements))) : of(undefined),
  });
  protected readonly chosen = computed(() => this.data.sponsors.find((s) => s.id === this.sponsorId()) ?? null);

  constructor() {
    // A newly chosen sponsor's list preselects the earliest due, the one the server would pick.
    effect(() => this.form.controls.deliverableId.setValue(this.promises.value()?.[0]?.deliverableId ?? 0));
  }

  protected insert(): void {
    this.form.markAllAsTouched();
    const sponsor = this.chosen();
    if (this.form.invalid || !sponsor) {
      if (!sponsor) this.form.controls.sponsorId.setErrors({ server: 'Choose the sponsor to thank.' });
      return;
    }
    const deliverableId = this.form.controls.deliverableId.value;
    const listed = this.promises.value()?.some((p) => p.deliverableId === deliverableId) ?? false;
    this.ref.close(creditMarker(sponsor.slug, listed ? deliverableId : null, this.form.controls.note.value));
  }
}
