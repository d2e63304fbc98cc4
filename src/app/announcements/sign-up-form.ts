import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormControl, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { applyServerErrors } from '../core/api-error';
import { FieldErrorPipe } from '../shared/field-error-pipe';
import type { SignUpPage } from '@contracts/announcements/subscription-schemas';
import type { Topic } from '@contracts/announcements/topics';
import { AnnouncementsApi } from './announcements-api';

let nextId = 0;

/**
 * "Tell me" sign-up: the lists to tick, the address, and the consent wording shown as the server words it. A product
 * page passes `productId` and offers drops of that product only. The answer is the same for every address.
 */
@Component({
  selector: 'ps-sign-up-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    FieldErrorPipe,
  ],
  templateUrl: './sign-up-form.html',
  styles: `
    .sign-up {
      max-width: 520px;
    }
    fieldset {
      border: 0;
      padding: 0;
      margin: 0 0 8px;
      display: flex;
      flex-direction: column;
    }
    legend {
      font-weight: 500;
      margin-bottom: 4px;
    }
    .wording {
      font-size: 0.875rem;
      color: var(--mat-sys-on-surface-variant);
    }
    .topics-error {
      color: var(--mat-sys-error);
      font-size: 0.8125rem;
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignUpForm {
  private readonly api = inject(AnnouncementsApi);
  readonly page = input<SignUpPage>('home');
  readonly productId = input<number | null>(null);
  readonly productName = input<string | null>(null);
  readonly email = input<string>('');
  readonly heading = input('Tell me');

  protected readonly uid = `ps-sign-up-${nextId++}`;
  protected readonly wording = rxResource({ stream: () => this.api.wording() });
  /** The lists offered: drops alone for a product, every list elsewhere. */
  protected readonly topics = computed(() => {
    const all = this.wording.value()?.topics ?? [];
    return this.productId()
      ? all
          .filter((t) => t.code === 'drops')
          .map((t) => ({ ...t, label: `the next run of ${this.productName() ?? 'this product'}` }))
      : all;
  });
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    topics: new FormControl<Topic[]>([], { nonNullable: true }),
  });
  protected readonly sent = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    effect(() => {
      if (this.email()) this.form.controls.email.setValue(this.email());
      if (this.productId()) this.form.controls.topics.setValue(['drops']);
    });
  }

  protected ticked(code: Topic): boolean {
    return this.form.controls.topics.value.includes(code);
  }

  protected toggle(code: Topic, on: boolean): void {
    const now = this.form.controls.topics.value.filter((t) => t !== code);
    this.form.controls.topics.setValue(on ? [...now, code] : now);
    this.form.controls.topics.setErrors(null);
  }

  protected async send(): Promise<void> {
    this.form.markAllAsTouched();
    this.problem.set(null);
    if (this.form.controls.topics.value.length === 0)
      this.form.controls.topics.setErrors({ server: 'Tick at least one list.' });
    if (this.form.invalid) return;
    this.busy.set(true);
    try {
      const { email, topics } = this.form.getRawValue();
      await firstValueFrom(
        this.api.signUp({
          email,
          topics,
          page: this.page(),
          ...(this.productId() ? { productId: this.productId()! } : {}),
        }),
      );
      this.sent.set(true);
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err, { 'topics.0': 'topics', productId: 'topics' }));
    } finally {
      this.busy.set(false);
    }
  }
}
