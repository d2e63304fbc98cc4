import QRCode from 'qrcode';
import { cameraProblem, readQrCode } from './read-qr-code';

/** A QR code drawn as a camera frame would hold it: dark modules on white, a quiet zone, `scale` pixels a module. */
function frameOf(text: string, scale = 6, quiet = 4): { rgba: Uint8ClampedArray; size: number } {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const size = (modules.size + 2 * quiet) * scale;
  const rgba = new Uint8ClampedArray(size * size * 4).fill(255);
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const mx = Math.floor(x / scale) - quiet;
      const my = Math.floor(y / scale) - quiet;
      if (mx >= 0 && my >= 0 && mx < modules.size && my < modules.size && modules.get(my, mx)) {
        rgba.fill(0, (y * size + x) * 4, (y * size + x) * 4 + 3);
      }
    }
  }
  return { rgba, size };
}

describe('readQrCode', () => {
  it('should read the code of a member card from a frame', () => {
    const token = 'v1.01042.1727740800.Zm9vYmFyYmF6cXV4';
    const { rgba, size } = frameOf(token);
    expect(readQrCode(rgba, size, size)).toBe(token);
  });

  it('should answer null for a frame without a code', () => {
    const blank = new Uint8ClampedArray(200 * 200 * 4).fill(255);
    expect(readQrCode(blank, 200, 200)).toBeNull();
  });
});

describe('cameraProblem', () => {
  it('should tell a refused camera from a missing or busy one', () => {
    expect(cameraProblem(new DOMException('denied', 'NotAllowedError'))).toContain('camera was refused');
    expect(cameraProblem(new DOMException('none', 'NotFoundError'))).toContain('No camera was found');
    expect(cameraProblem(new DOMException('busy', 'NotReadableError'))).toContain('another app');
    expect(cameraProblem('odd')).toContain('could not start');
  });
});
