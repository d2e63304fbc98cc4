import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { applyServerErrors } from '../../core/api-error';
import { SessionStore } from '../../core/session-store';
import { PAYMENT_METHOD_LABELS } from '@contracts/labels/payment-methods';
import { ClubDatePipe } from '../../shared/club-date-pipe';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { MoneyPipe } from '../../shared/money-pipe';
import { DELIVERABLE_KIND_LABELS as KIND_LABELS, type DeliverableKind } from '@contracts/labels/deliverable-kinds';
import { ImageUpload } from '../posts/image-upload';
import { PROVINCES, type Province } from '@contracts/shop/provinces';
import type { StaffAgreement } from '@contracts/sponsors/sponsor-answers';
import type { CashMethod, HandCreditKind } from '@contracts/sponsors/sponsor-schemas';
import type { TaxTreatment } from '@contracts/sponsors/tax-treatments';
import { SponsorAdminApi } from './sponsor-admin-api';
import { dollarsToCents } from '../../shared/dollars';

const HAND_KINDS: HandCreditKind[] = ['video_mention', 'social_post', 'logo_on_merch', 'sponsors_page'];
const METHODS: CashMethod[] = ['e-transfer', 'cheque', 'cash', 'card', 'other'];
/** A province select: a province, or none chosen yet. */
type ProvinceChoice = Province | '';
type TreatmentForm = FormGroup<{ taxTreatment: FormControl<TaxTreatment>; province: FormControl<ProvinceChoice> }>;

/** One sponsor: details and logo, contacts, agreements with their ledger, cash received and hand-recorded credits. */
@Component({
  selector: 'ps-sponsor-detail',
  imports: [
    ClubDatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
    MoneyPipe,
    ImageUpload,
  ],
  templateUrl: './sponsor-detail.html',
  styles: `
    .wide {
      max-width: none;
    }
    .card {
      background: #fff;
      border-radius: 12px;
      padding: 8px 16px 16px;
      margin: 16px 0;
    }
    .inline {
      display: flex;
      gap: 12px;
      flex-wrap: wrap;
      align-items: baseline;
    }
    table {
      border-collapse: collapse;
      width: 100%;
    }
    th,
    td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .late {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
    .logo {
      max-height: 64px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SponsorDetail {
  private readonly api = inject(SponsorAdminApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly session = inject(SessionStore);

  readonly id = input.required<string>();

  protected readonly labels: Record<string, string> = KIND_LABELS;
  protected readonly handKinds = HAND_KINDS;
  protected readonly allKinds = Object.keys(KIND_LABELS) as DeliverableKind[];
  protected readonly provinces = PROVINCES;
  protected readonly methodLabels = PAYMENT_METHOD_LABELS;
  protected readonly methods = METHODS;
  protected readonly detail = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.detail(params),
  });
  protected readonly ledger = rxResource({
    params: () => Number(this.id()),
    stream: ({ params }) => this.api.ledger(params),
  });

  protected readonly info = this.fb.group({
    name: ['', Validators.required],
    website: [''],
    blurb: [''],
    logoUrl: [''],
  });
  protected readonly contact = this.fb.group({ email: ['', [Validators.required, Validators.email]] });
  protected readonly agreement = this.fb.group({
    season: [String(new Date().getFullYear()), Validators.required],
    cashDollars: [0],
    taxTreatment: ['gift' as TaxTreatment],
    taxProvince: ['' as ProvinceChoice],
    inKindDescription: [''],
    inKindDollars: [0],
    inKindReceivedOn: [''],
    kind: ['build_log_credit' as DeliverableKind],
    quantity: [1],
    dueOn: ['', Validators.required],
  });
  protected readonly credit = this.fb.group({
    kind: ['video_mention' as HandCreditKind],
    url: [''],
    videoTimestamp: [''],
    note: [''],
    creditedOn: [''],
  });
  protected readonly cash = this.fb.group({
    receivedOn: ['', Validators.required],
    method: ['e-transfer' as CashMethod],
  });
  protected readonly problems = signal<Record<string, string | null>>({});

  constructor() {
    effect(() => {
      const d = this.detail.value();
      if (d)
        this.info.reset({
          name: d.sponsor.name,
          website: d.sponsor.website ?? '',
          blurb: d.sponsor.blurb ?? '',
          logoUrl: d.sponsor.logoUrl ?? '',
        });
    });
  }

  protected async saveInfo(): Promise<void> {
    await this.run('info', this.info, async () => {
      const v = this.info.getRawValue();
      await firstValueFrom(this.api.update(Number(this.id()), { ...v, logoUrl: v.logoUrl || null }));
      this.detail.reload();
      return 'Sponsor saved.';
    });
  }

  protected async addContact(): Promise<void> {
    await this.run('contact', this.contact, async () => {
      await firstValueFrom(this.api.addContact(Number(this.id()), this.contact.getRawValue().email));
      this.contact.reset();
      this.detail.reload();
      return 'Contact added.';
    });
  }

  protected async addAgreement(): Promise<void> {
    await this.run('agreement', this.agreement, async () => {
      const v = this.agreement.getRawValue();
      await firstValueFrom(
        this.api.addAgreement(Number(this.id()), {
          season: v.season,
          cashCents: dollarsToCents(v.cashDollars),
          taxTreatment: v.taxTreatment,
          taxProvince: v.taxTreatment === 'promotion' ? v.taxProvince || null : null,
          inKind: v.inKindDescription
            ? [
                {
                  description: v.inKindDescription,
                  valueCents: dollarsToCents(v.inKindDollars),
                  receivedOn: v.inKindReceivedOn || null,
                },
              ]
            : [],
          deliverables: [{ kind: v.kind, quantity: Number(v.quantity), dueOn: v.dueOn }],
        }),
      );
      this.ledger.reload();
      return 'Agreement added.';
    });
  }

  private readonly treatmentForms = new Map<number, TreatmentForm>();

  /** The tax-treatment form of one agreement, made once per agreement. */
  protected treatmentForm(a: StaffAgreement): TreatmentForm {
    let form = this.treatmentForms.get(a.id);
    if (!form) {
      form = this.fb.group({
        taxTreatment: [a.taxTreatment ?? 'gift'],
        province: [(a.taxProvince ?? '') as ProvinceChoice],
      });
      this.treatmentForms.set(a.id, form);
    }
    return form;
  }

  protected invoiceUrl(agreementId: number): string {
    return this.api.invoiceUrl(agreementId);
  }

  protected async saveTreatment(a: StaffAgreement): Promise<void> {
    const form = this.treatmentForm(a);
    await this.run(`treatment-${a.id}`, form, async () => {
      const v = form.getRawValue();
      await firstValueFrom(
        this.api.setTaxTreatment(a.id, {
          taxTreatment: v.taxTreatment,
          province: v.taxTreatment === 'promotion' ? v.province || null : null,
        }),
      );
      this.treatmentForms.delete(a.id);
      this.ledger.reload();
      return v.taxTreatment === 'promotion'
        ? 'Set to promotion: GST/HST is charged when the cash is recorded.'
        : 'Set to gift: no tax.';
    });
  }

  protected async recordCash(agreementId: number): Promise<void> {
    await this.run('cash', this.cash, async () => {
      await firstValueFrom(this.api.cashReceived(agreementId, this.cash.getRawValue()));
      this.ledger.reload();
      return 'Cash recorded as received.';
    });
  }

  protected async addCredit(): Promise<void> {
    await this.run('credit', this.credit, async () => {
      const v = this.credit.getRawValue();
      const res = await firstValueFrom(
        this.api.addCredit(Number(this.id()), {
          kind: v.kind,
          url: v.url || null,
          videoTimestamp: v.videoTimestamp || null,
          note: v.note || null,
          ...(v.creditedOn ? { creditedOn: v.creditedOn } : {}),
        }),
      );
      this.credit.reset({ kind: v.kind });
      this.ledger.reload();
      this.detail.reload();
      return res.counted
        ? 'Credit recorded against the agreement.'
        : 'Credit recorded (nothing open of that kind, so it is an extra).';
    });
  }

  /** Submits one of the page's forms; server field errors land beside the fields, the message above the form. */
  private async run(
    key: string,
    form: { markAllAsTouched(): void; invalid: boolean } & Parameters<typeof applyServerErrors>[0],
    work: () => Promise<string>,
  ): Promise<void> {
    form.markAllAsTouched();
    if (form.invalid) return;
    this.problems.update((p) => ({ ...p, [key]: null }));
    try {
      this.snackBar.open(await work(), undefined, { duration: 3000 });
    } catch (err) {
      const message = applyServerErrors(form, err);
      this.problems.update((p) => ({ ...p, [key]: message }));
    }
  }
}
