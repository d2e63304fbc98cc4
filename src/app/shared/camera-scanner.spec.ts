import { TestBed } from '@angular/core/testing';
import { CameraScanner } from './camera-scanner';

/** A stream with one track whose stop() is watched. */
function fakeStream() {
  const track = { stop: jest.fn() };
  return { track, stream: { getTracks: () => [track] } as unknown as MediaStream };
}

describe('CameraScanner', () => {
  const original = Object.getOwnPropertyDescriptor(navigator, 'mediaDevices');
  let getUserMedia: jest.Mock;

  beforeEach(() => {
    getUserMedia = jest.fn();
    Object.defineProperty(navigator, 'mediaDevices', { configurable: true, value: { getUserMedia } });
    // jsdom plays no media.
    jest.spyOn(HTMLMediaElement.prototype, 'play').mockResolvedValue(undefined);
  });
  afterEach(() => {
    jest.restoreAllMocks();
    if (original) Object.defineProperty(navigator, 'mediaDevices', original);
    else delete (navigator as unknown as Record<string, unknown>)['mediaDevices'];
  });

  async function open() {
    const fixture = TestBed.createComponent(CameraScanner);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const button = () => el.querySelector<HTMLButtonElement>('button')!;
    return { fixture, el, button };
  }

  it('should ask for the back camera, show the preview, and release the camera on Stop', async () => {
    const { track, stream } = fakeStream();
    getUserMedia.mockResolvedValue(stream);
    const { fixture, el, button } = await open();
    button().click();
    await fixture.whenStable();
    expect(getUserMedia).toHaveBeenCalledWith({ video: { facingMode: { ideal: 'environment' } }, audio: false });
    expect(el.querySelector('video')!.hidden).toBe(false);
    expect(el.textContent).toContain('Hold the code');
    button().click();
    await fixture.whenStable();
    expect(track.stop).toHaveBeenCalled();
    expect(el.querySelector('video')!.hidden).toBe(true);
    expect(button().textContent).toContain('Scan with camera');
  });

  it('should release the camera when the page goes away', async () => {
    const { track, stream } = fakeStream();
    getUserMedia.mockResolvedValue(stream);
    const { fixture, button } = await open();
    button().click();
    await fixture.whenStable();
    fixture.destroy();
    expect(track.stop).toHaveBeenCalled();
  });

  it('should say so beside the button when the camera is refused', async () => {
    getUserMedia.mockRejectedValue(new DOMException('Permission denied', 'NotAllowedError'));
    const { fixture, el, button } = await open();
    button().click();
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('The camera was refused');
    expect(button().textContent).toContain('Scan with camera');
  });

  it('should say so when the device has no camera', async () => {
    getUserMedia.mockRejectedValue(new DOMException('Requested device not found', 'NotFoundError'));
    const { fixture, el, button } = await open();
    button().click();
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('No camera was found');
  });

  it('should say so when the browser offers no camera at all', async () => {
    Object.defineProperty(navigator, 'mediaDevices', { configurable: true, value: undefined });
    const { fixture, el, button } = await open();
    button().click();
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')!.textContent).toContain('offers no camera');
  });
});
