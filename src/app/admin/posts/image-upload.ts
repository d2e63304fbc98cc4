import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { apiErrorMessage } from '../../core/api-error';
import { PostAdminApi } from './post-admin-api';

/** Picks an image, uploads it with a progress bar, and emits the stored address. */
@Component({
  selector: 'ps-image-upload',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <div class="upload">
      <input
        #picker
        type="file"
        accept="image/jpeg,image/png,image/webp,image/gif"
        (change)="send(picker)"
        class="ps-visually-hidden"
        [attr.aria-label]="label()"
        [id]="inputId()"
      />
      <button mat-stroked-button type="button" (click)="picker.click()" [disabled]="progress() !== null">
        <mat-icon>upload</mat-icon> {{ label() }}
      </button>
      @if (progress() !== null) {
        <mat-progress-bar
          mode="determinate"
          [value]="progress()"
          [attr.aria-label]="'Uploading: ' + progress() + '%'"
        />
        <span class="pct" aria-live="polite">{{ progress() }}%</span>
      }
      @if (problem(); as message) {
        <span class="form-problem" role="alert">{{ message }}</span>
      }
    </div>
  `,
  styles: `
    .upload {
      display: flex;
      align-items: center;
      gap: 12px;
      flex-wrap: wrap;
    }
    mat-progress-bar {
      width: 180px;
    }
    .pct {
      font-variant-numeric: tabular-nums;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImageUpload {
  private readonly api = inject(PostAdminApi);

  readonly label = input('Upload image');
  readonly inputId = input('image-upload');
  readonly uploaded = output<string>();

  protected readonly progress = signal<number | null>(null);
  protected readonly problem = signal<string | null>(null);

  protected send(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    picker.value = '';
    if (!file) return;
    this.problem.set(null);
    this.progress.set(0);
    this.api.upload(file).subscribe({
      next: (e) => {
        if (e.type === HttpEventType.UploadProgress)
          this.progress.set(e.total ? Math.round((100 * e.loaded) / e.total) : 0);
        if (e.type === HttpEventType.Response && e.body) {
          this.progress.set(null);
          this.uploaded.emit(e.body.url);
        }
      },
      error: (err) => {
        this.progress.set(null);
        this.problem.set(apiErrorMessage(err));
      },
    });
  }
}
