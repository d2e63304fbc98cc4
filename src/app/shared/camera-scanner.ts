import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  inject,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { DOCUMENT } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { cameraProblem, readQrCode } from './read-qr-code';

type ScannerState = 'idle' | 'starting' | 'scanning';

/** Frames are read a few times a second: enough to catch a card held still, light on a phone's battery. */
const FRAME_INTERVAL_MS = 150;
/** Frames are scaled down to this width before decoding; a card filling part of the view still reads. */
const DECODE_WIDTH = 640;

/** The part of the Permissions Policy API Chromium exposes; absent elsewhere, where getUserMedia tells instead. */
interface PolicyDocument {
  featurePolicy?: { allowsFeature(feature: string): boolean };
}

/**
 * "Scan with camera": a live preview from the phone's back camera, read with a QR decoder until a code shows, which
 * is emitted once; the camera is then released. It is also released on Stop, when the page is hidden and when the
 * host page goes away. Typing or pasting the code stays with the host form.
 */
@Component({
  selector: 'ps-camera-scanner',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './camera-scanner.html',
  styleUrl: './camera-scanner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(document:visibilitychange)': 'stopWhenHidden()' },
})
export class CameraScanner {
  /** The text of the code read from the camera. */
  readonly scanned = output<string>();

  private readonly document = inject(DOCUMENT);
  private readonly video = viewChild<ElementRef<HTMLVideoElement>>('preview');
  protected readonly state = signal<ScannerState>('idle');
  protected readonly problem = signal<string | null>(null);
  /** The page was opened inside the app, where the camera is not granted; a full load of the same address is. */
  protected readonly needsReload = signal(false);
  private stream: MediaStream | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private canvas: HTMLCanvasElement | null = null;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  protected async start(): Promise<void> {
    this.problem.set(null);
    this.needsReload.set(false);
    if ((this.document as Document & PolicyDocument).featurePolicy?.allowsFeature('camera') === false) {
      this.problem.set('The camera is only offered when this page is opened directly.');
      this.needsReload.set(true);
      return;
    }
    const media = this.document.defaultView?.navigator.mediaDevices;
    if (!media?.getUserMedia) {
      this.problem.set(
        'This browser offers no camera here (it needs a secure connection). Type or paste the code instead.',
      );
      return;
    }
    this.state.set('starting');
    try {
      const stream = await media.getUserMedia({ video: { facingMode: { ideal: 'environment' } }, audio: false });
      if (this.state() !== 'starting') {
        // Stopped (or the page left) while the browser was asking.
        stream.getTracks().forEach((t) => t.stop());
        return;
      }
      this.stream = stream;
      const video = this.video()!.nativeElement;
      video.srcObject = stream;
      await video.play();
      this.state.set('scanning');
      this.readSoon();
    } catch (err) {
      this.stop();
      this.problem.set(cameraProblem(err));
    }
  }

  /** Releases the camera: every track stopped, so the phone's camera light goes out. */
  stop(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    this.stream?.getTracks().forEach((t) => t.stop());
    this.stream = null;
    const video = this.video()?.nativeElement;
    if (video) video.srcObject = null;
    this.state.set('idle');
  }

  protected stopWhenHidden(): void {
    if (this.document.visibilityState === 'hidden' && this.state() !== 'idle') this.stop();
  }

  protected reload(): void {
    this.document.location.reload();
  }

  private readSoon(): void {
    this.timer = setTimeout(() => this.readFrame(), FRAME_INTERVAL_MS);
  }

  private readFrame(): void {
    this.timer = null;
    if (this.state() !== 'scanning') return;
    const video = this.video()!.nativeElement;
    const text = video.videoWidth > 0 ? this.decode(video) : null;
    if (text) {
      this.stop();
      this.scanned.emit(text);
    } else {
      this.readSoon();
    }
  }

  private decode(video: HTMLVideoElement): string | null {
    const scale = Math.min(1, DECODE_WIDTH / video.videoWidth);
    const width = Math.round(video.videoWidth * scale);
    const height = Math.round(video.videoHeight * scale);
    this.canvas ??= this.document.createElement('canvas');
    this.canvas.width = width;
    this.canvas.height = height;
    const context = this.canvas.getContext('2d', { willReadFrequently: true });
    if (!context) return null;
    context.drawImage(video, 0, 0, width, height);
    return readQrCode(context.getImageData(0, 0, width, height).data, width, height);
  }
}
