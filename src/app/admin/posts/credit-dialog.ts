import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { map, of } from 'rxjs';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { SponsorAdminApi, type AdminSponsorRow } from '../sponsors/sponsor-admin-api';
import { creditMarker, promiseCounted, type CountedPromise } from './credit-marker';

/** The sponsors an editor may thank. */
export interface CreditDialogData {
  sponsors: readonly AdminSponsorRow[];
}

/**
 * Thanks a sponsor in the text: the editor picks the sponsor, sees which promise of theirs the post will count
 * against once published, writes an optional note, and gets the credit line inserted for them.
 */
@Component({
  selector: 'ps-credit-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, FieldErrorPipe],
  templateUrl: './credit-dialog.html',
  styles: `.counted { margin: 0 0 16px; } mat-form-field { width: 100%; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CreditDialog {
  private readonly api = inject(SponsorAdminApi);
  private readonly ref = inject<MatDialogRef<CreditDialog, string>>(MatDialogRef);
  protected readonly data = inject<CreditDialogData>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    sponsorId: [0, Validators.min(1)],
    note: ['', Validators.maxLength(200)],
  });
  private readonly sponsorId = toSignal(this.form.controls.sponsorId.valueChanges, { initialValue: 0 });
  /** The promise the credit will count against, or null when the sponsor has no open build-log promise. */
  protected readonly counted = rxResource<CountedPromise | null | undefined, number>({
    params: () => this.sponsorId(),
    stream: ({ params }) => (params ? this.api.ledger(params).pipe(map((l) => promiseCounted(l.agreements))) : of(undefined)),
  });
  protected readonly chosen = computed(() => this.data.sponsors.find((s) => s.id === this.sponsorId()) ?? null);

  protected insert(): void {
    this.form.markAllAsTouched();
    const sponsor = this.chosen();
    if (this.form.invalid || !sponsor) {
      if (!sponsor) this.form.controls.sponsorId.setErrors({ server: 'Choose the sponsor to thank.' });
      return;
    }
    this.ref.close(creditMarker(sponsor.slug, this.form.controls.note.value));
  }
}
