import { ChangeDetectionStrategy, Component, DestroyRef, OnInit, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { Topic } from '@contracts/announcements/topics';
import { apiErrorMessage, applyServerErrors } from '../../core/api-error';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { AnnouncementAdminApi } from './announcement-admin-api';
import type { Announcement, AnnouncementPreview } from '@contracts/announcements/announcement-answers';

const POLL_MS = 2000;

/** Compose an announcement in Markdown, preview it as a recipient sees it, test it on yourself, send it, watch it go. */
@Component({
  selector: 'ps-announcement-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    FieldErrorPipe,
  ],
  templateUrl: './announcement-editor.html',
  styleUrl: './announcement-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnnouncementEditor implements OnInit {
  private readonly api = inject(AnnouncementAdminApi);
  private readonly router = inject(Router);
  readonly id = input<string>('new');

  protected readonly topics: { code: Topic; label: string }[] = [
    { code: 'drops', label: 'New runs and drops' },
    { code: 'launches', label: 'Launch days' },
    { code: 'build-logs', label: 'New build logs' },
  ];
  protected readonly form = inject(NonNullableFormBuilder).group({
    topic: ['drops' as Topic, Validators.required],
    subject: ['', [Validators.required, Validators.maxLength(200)]],
    markdown: ['', [Validators.required, Validators.maxLength(50_000)]],
  });
  protected readonly announcement = signal<Announcement | null>(null);
  protected readonly preview = signal<AnnouncementPreview | null>(null);
  protected readonly note = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly confirming = signal(false);
  protected readonly editable = computed(() => (this.announcement()?.status ?? 'draft') === 'draft');
  protected readonly progress = computed(() => {
    const c = this.announcement()?.counts;
    return c && c.recipients ? Math.round((100 * (c.sent + c.failed)) / c.recipients) : 0;
  });

  constructor() {
    const timer = setInterval(() => void this.refreshWhileSending(), POLL_MS);
    inject(DestroyRef).onDestroy(() => clearInterval(timer));
  }

  async ngOnInit(): Promise<void> {
    if (this.id() === 'new') return;
    try {
      this.show((await firstValueFrom(this.api.get(Number(this.id())))).announcement);
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    }
  }

  protected async save(): Promise<Announcement | null> {
    this.form.markAllAsTouched();
    if (this.form.invalid) return null;
    this.busy.set(true);
    this.problem.set(null);
    try {
      const current = this.announcement();
      const body = this.form.getRawValue();
      const { announcement } = await firstValueFrom(
        current ? this.api.update(current.id, body) : this.api.create(body),
      );
      this.show(announcement);
      this.form.markAsPristine();
      if (!current) await this.router.navigate(['/console/announcements', announcement.id], { replaceUrl: true });
      return announcement;
    } catch (err) {
      this.problem.set(applyServerErrors(this.form, err));
      return null;
    } finally {
      this.busy.set(false);
    }
  }

  protected async showPreview(): Promise<void> {
    const a = await this.saved();
    if (a) await this.run(async () => this.preview.set(await firstValueFrom(this.api.preview(a.id))));
  }

  protected async sendTest(): Promise<void> {
    const a = await this.saved();
    if (a)
      await this.run(async () =>
        this.note.set(`A test is on its way to ${(await firstValueFrom(this.api.test(a.id))).to}.`),
      );
  }

  protected async send(): Promise<void> {
    const a = await this.saved();
    if (!a) return;
    await this.run(async () => {
      this.show((await firstValueFrom(this.api.send(a.id))).announcement);
      this.note.set('Queued. The counts below follow the delivery.');
    });
    this.confirming.set(false);
  }

  protected headerList(p: AnnouncementPreview): [string, string][] {
    return Object.entries(p.headers);
  }

  /** The draft as stored, saving the form first when it changed. */
  private async saved(): Promise<Announcement | null> {
    return this.form.dirty || !this.announcement() ? this.save() : this.announcement();
  }

  private async run(work: () => Promise<void>): Promise<void> {
    this.busy.set(true);
    this.problem.set(null);
    try {
      await work();
    } catch (err) {
      this.problem.set(apiErrorMessage(err));
    } finally {
      this.busy.set(false);
    }
  }

  private show(a: Announcement): void {
    this.announcement.set(a);
    this.form.setValue({ topic: a.topic, subject: a.subject, markdown: a.markdown });
    if (a.status !== 'draft') this.form.disable();
  }

  private async refreshWhileSending(): Promise<void> {
    const a = this.announcement();
    if (a?.status !== 'sending') return;
    const { announcement } = await firstValueFrom(this.api.get(a.id)).catch(() => ({ announcement: a }));
    this.announcement.set(announcement);
  }
}
