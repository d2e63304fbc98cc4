import jsQR from 'jsqr';

/**
 * The text of the QR code in one RGBA frame (four bytes a pixel, row by row), or null when none can be read.
 * Member cards print dark modules on a light ground, so inverted codes are not searched for (half the work a frame).
 */
export function readQrCode(rgba: Uint8ClampedArray, width: number, height: number): string | null {
  const code = jsQR(rgba, width, height, { inversionAttempts: 'dontInvert' });
  const text = code?.data.trim();
  return text ? text : null;
}

/** What the camera scanner says when getUserMedia fails, by the DOMException name the browser gives. */
export function cameraProblem(err: unknown): string {
  const name =
    err instanceof Error || (typeof err === 'object' && err !== null && 'name' in err)
      ? String((err as { name: unknown }).name)
      : '';
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return 'The camera was refused. Allow the camera for this site in the browser settings and try again, or type or paste the code.';
    case 'NotFoundError':
    case 'OverconstrainedError':
      return 'No camera was found on this device. Type or paste the code instead.';
    case 'NotReadableError':
    case 'AbortError':
      return 'The camera could not start; another app may be using it. Close that app and try again, or type the code.';
    default:
      return 'The camera could not start. Type or paste the code instead.';
  }
}
