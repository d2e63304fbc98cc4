import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource, takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { DomSanitizer } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, debounceTime, firstValueFrom, of, startWith, switchMap } from 'rxjs';
import { applyServerErrors } from '../../core/api-error';
import { HazardNotice } from '../../build-logs/hazard-notice';
import { POST_STATUS_LABELS } from '@contracts/labels/post-states';
import { FieldErrorPipe } from '../../shared/field-error-pipe';
import { LabelPipe } from '../../shared/label-pipe';
import { SponsorAdminApi } from '../sponsors/sponsor-admin-api';
import { CreditDialog, type CreditDialogData } from './credit-dialog';
import { ImageUpload } from './image-upload';
import type { AdminPost } from '@contracts/build-logs/post-answers';
import type { PostBodyInput } from '@contracts/build-logs/post-schemas';
import type { PostStatus } from '@contracts/labels/post-states';
import { PostAdminApi } from './post-admin-api';

/** Writes a build log: Markdown with the live preview from the server's pipeline, images, credits, schedule, publish. */
@Component({
  selector: 'ps-post-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    FieldErrorPipe,
    LabelPipe,
    ImageUpload,
    HazardNotice,
  ],
  templateUrl: './post-editor.html',
  styleUrl: './post-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PostEditor {
  private readonly api = inject(PostAdminApi);
  private readonly sponsorsApi = inject(SponsorAdminApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly statusLabels = POST_STATUS_LABELS;
  private readonly dom = inject(DomSanitizer);
  private readonly dialog = inject(MatDialog);
  private readonly body = viewChild<ElementRef<HTMLTextAreaElement>>('body');

  /** The post id from the route, or 'new'. */
  readonly id = input.required<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    title: ['', [Validators.required, Validators.maxLength(160)]],
    slug: [''],
    summary: ['', Validators.maxLength(400)],
    tags: [''],
    markdown: ['', Validators.required],
    coverUrl: [''],
    membersOnly: [false],
    hazardNotice: [false],
    publishAt: [''],
    credits: [[] as number[]],
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly loaded = signal<AdminPost | null>(null);
  protected readonly sponsors = rxResource({ stream: () => this.sponsorsApi.list() });
  protected readonly status = computed(() => this.loaded()?.status ?? 'draft');

  private readonly formValue = toSignal(this.form.valueChanges.pipe(startWith(this.form.getRawValue())), {
    initialValue: this.form.getRawValue(),
  });
  /** The preview follows the text after a short pause, through the same server pipeline as the public page. */
  protected readonly preview = toSignal(
    toObservable(
      computed(() => ({
        markdown: this.formValue().markdown ?? '',
        title: this.formValue().title ?? '',
        summary: this.formValue().summary ?? '',
        tags: this.tagList(this.formValue().tags ?? ''),
      })),
    ).pipe(
      debounceTime(300),
      switchMap((v) =>
        v.markdown.trim()
          ? this.api.preview(v).pipe(catchError(() => of(null)))
          : of({ html: '', hazardNotice: false, unknownSponsors: [] }),
      ),
    ),
    { initialValue: null },
  );
  protected readonly previewHtml = computed(() => {
    const html = this.preview()?.html ?? '';
    // Sanitized on the server by the one pipeline; Angular's sanitizer would drop task-list checkboxes.
    return this.dom.bypassSecurityTrustHtml(html);
  });
  protected readonly hazardRequired = computed(
    () => this.preview()?.hazardNotice ?? this.loaded()?.hazardRequired ?? false,
  );

  constructor() {
    toObservable(this.id)
      .pipe(
        switchMap((id) => (id === 'new' ? of(null) : this.api.get(Number(id)))),
        takeUntilDestroyed(),
      )
      .subscribe((post) => {
        this.loaded.set(post);
        if (post) {
          this.form.patchValue({
            title: post.title,
            slug: post.slug,
            summary: post.summary,
            tags: post.tags.join(', '),
            markdown: post.markdown,
            coverUrl: post.coverUrl ?? '',
            membersOnly: post.membersOnly,
            hazardNotice: post.hazardNotice,
            publishAt: post.publishAt ? this.localInput(post.publishAt) : '',
            credits: post.credits.map((c) => c.sponsorId),
          });
        }
      });
  }

  /** Asks which sponsor to thank (and the note), then puts the credit line on a line of its own at the cursor. */
  protected async thankSponsor(): Promise<void> {
    const data: CreditDialogData = { sponsors: this.sponsors.value()?.items ?? [] };
    const line = await firstValueFrom(
      this.dialog
        .open<CreditDialog, CreditDialogData, string>(CreditDialog, { data, width: 'min(520px, 96vw)' })
        .afterClosed(),
    );
    if (line) this.insertAtCursor(`\n${line}\n`);
  }

  protected insertImage(url: string): void {
    this.insertAtCursor(`\n![Describe the picture](${url})\n`);
  }

  protected async save(status: PostStatus): Promise<void> {
    this.form.markAllAsTouched();
    if (this.form.controls.title.invalid || this.form.controls.markdown.invalid) return;
    this.busy.set(true);
    this.problem.set(null);
    const v = this.form.getRawValue();
    const body: PostBodyInput = {
      title: v.title,
      ...(v.slug ? { slug: v.slug } : {}),
      summary: v.summary,
      markdown: v.markdown,
      tags: this.tagList(v.tags),
      coverUrl: v.coverUrl || null,
      membersOnly: v.membersOnly,
      hazardNotice: v.hazardNotice,
      status,
      publishAt: status === 'scheduled' && v.publishAt ? new Date(v.publishAt).toISOString() : null,
      credits: v.credits,
    };
    try {
      const current = this.loaded();
      const res = await firstValueFrom(current ? this.api.update(current.id, body) : this.api.create(body));
      const words = {
        draft: current?.status === 'published' ? 'Unpublished; credits withdrawn.' : 'Draft saved.',
        scheduled: 'Scheduled.',
        published: 'Published.',
      }[status];
      this.snackBar.open(words, undefined, { duration: 4000 });
      this.loaded.set(await firstValueFrom(this.api.get(res.id)));
      if (!current) await this.router.navigate(['/console/posts', res.id], { replaceUrl: true });
    } catch (err) {
      if (status === 'scheduled' && !v.publishAt)
        this.form.controls.publishAt.setErrors({ server: 'Pick a date and time.' });
      this.problem.set(applyServerErrors(this.form, err));
    } finally {
      this.busy.set(false);
    }
  }

  private insertAtCursor(text: string): void {
    const area = this.body()?.nativeElement;
    const value = this.form.controls.markdown.value;
    const at = area ? area.selectionStart : value.length;
    this.form.controls.markdown.setValue(value.slice(0, at) + text + value.slice(at));
    area?.focus();
  }

  private tagList(text: string): string[] {
    return text
      .split(',')
      .map((t) => t.trim().toLowerCase())
      .filter(Boolean);
  }

  private localInput(iso: string): string {
    const d = new Date(iso);
    return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
  }
}
