import jsQR from 'jsqr';
import QRCode from 'qrcode';
import sharp from 'sharp';
import { describe, expect, it, vi } from 'vitest';

import { boardQrCode } from '@/features/schedule/utils/qr-code';

/** What a phone's camera reads from a PNG data URL: the code's text (jsQR decodes it). */
async function scan(dataUrl: string): Promise<string | null> {
  const png = Buffer.from(dataUrl.replace(/^data:image\/png;base64,/, ''), 'base64');
  // A quiet zone around the code, as the printed sheet leaves white paper around it
  const { data, info } = await sharp(png)
    .extend({ top: 16, bottom: 16, left: 16, right: 16, background: '#ffffff' })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return jsQR(new Uint8ClampedArray(data), info.width, info.height)?.data ?? null;
}

describe('the board link as a QR code', () => {
  it('scans back to the board’s link', async () => {
    const url = 'https://boards.example.test/boards/5f0c2a4e-8d1b-4c3a-9e7f-2b6d1a0c9e88';
    expect(await scan(await boardQrCode(url))).toBe(url);
    const other = 'https://boards.example.test/boards/0a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d';
    expect(await scan(await boardQrCode(other))).toBe(other);
  });

  it('is drawn once per link: a second request for it is answered from memory', async () => {
    const url = 'https://boards.example.test/boards/c2d6f1e0-3b4a-4f5e-8a9b-0c1d2e3f4a5b';
    const draw = vi.spyOn(QRCode, 'toDataURL');
    try {
      const first = await boardQrCode(url);
      const again = await boardQrCode(url);
      expect(again).toBe(first);
      expect(draw).toHaveBeenCalledTimes(1);
    } finally {
      draw.mockRestore();
    }
  });
});
