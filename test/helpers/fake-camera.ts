import { writeFileSync } from 'node:fs';
import QRCode from 'qrcode';

const WIDTH = 640;
const HEIGHT = 480;

/**
 * Writes a Y4M video (YUV4MPEG2, 4:2:0) that shows `text` as a QR code, dark modules on white, for Chromium's
 * `--use-file-for-fake-video-capture`: the browser's camera then films a member card held still.
 */
export function writeQrVideo(file: string, text: string, frames = 3): void {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const quiet = 4;
  const scale = Math.floor((Math.min(WIDTH, HEIGHT) * 0.8) / (modules.size + 2 * quiet));
  const side = (modules.size + 2 * quiet) * scale;
  const left = Math.floor((WIDTH - side) / 2);
  const top = Math.floor((HEIGHT - side) / 2);
  // Luma in the video range (16 black, 235 white); a grey surround like a table under the card.
  const luma = Buffer.alloc(WIDTH * HEIGHT, 120);
  for (let y = 0; y < side; y++) {
    for (let x = 0; x < side; x++) {
      const mx = Math.floor(x / scale) - quiet;
      const my = Math.floor(y / scale) - quiet;
      const dark = mx >= 0 && my >= 0 && mx < modules.size && my < modules.size && modules.get(my, mx);
      luma[(top + y) * WIDTH + left + x] = dark ? 16 : 235;
    }
  }
  const chroma = Buffer.alloc((WIDTH / 2) * (HEIGHT / 2) * 2, 128);
  const header = Buffer.from(`YUV4MPEG2 W${WIDTH} H${HEIGHT} F10:1 Ip A1:1 C420jpeg\n`);
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma]);
  writeFileSync(file, Buffer.concat([header, ...Array.from({ length: frames }, () => frame)]));
}
