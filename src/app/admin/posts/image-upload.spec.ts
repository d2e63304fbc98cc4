import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ImageUpload } from './image-upload';

describe('ImageUpload', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] }));

  const pick = (fixture: ReturnType<typeof TestBed.createComponent<ImageUpload>>) => {
    const input = fixture.nativeElement.querySelector('input[type=file]') as HTMLInputElement;
    Object.defineProperty(input, 'files', {
      value: [new File([new Uint8Array(10)], 'fin.png', { type: 'image/png' })],
    });
    input.dispatchEvent(new Event('change'));
  };

  it('should show the upload progress as a bar and emit the stored address when done', async () => {
    const fixture = TestBed.createComponent(ImageUpload);
    const urls: string[] = [];
    fixture.componentInstance.uploaded.subscribe((u) => urls.push(u));
    await fixture.whenStable();
    pick(fixture);
    const req = TestBed.inject(HttpTestingController).expectOne('/api/admin/uploads');
    expect(req.request.reportProgress).toBe(true);
    req.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 100 });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).not.toBeNull();
    expect(fixture.nativeElement.textContent).toContain('40%');
    req.flush({ url: '/uploads/abc.png', thumbnailUrl: '/uploads/abc-thumb.webp' });
    await fixture.whenStable();
    expect(urls).toEqual(['/uploads/abc.png']);
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).toBeNull();
  });

  it('should show the server message when the upload is refused', async () => {
    const fixture = TestBed.createComponent(ImageUpload);
    await fixture.whenStable();
    pick(fixture);
    TestBed.inject(HttpTestingController)
      .expectOne('/api/admin/uploads')
      .flush(
        { error: { code: 'unsupported_file', message: 'Upload a JPEG, PNG, WebP or GIF image.' } },
        { status: 415, statusText: 'Unsupported Media Type' },
      );
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain(
      'Upload a JPEG, PNG, WebP or GIF image.',
    );
  });
});
