import { LRUCache } from 'lru-cache';
import QRCode from 'qrcode';

// A board's link never changes, and drawing its code takes about 3 ms of the event loop (the
// schedule page drew it on every request: a sixth of the page's CPU)
const codes = new LRUCache<string, Promise<string>>({ max: 2000 });

/** A QR code of a link, as a PNG data URL (for the PDF and the browser print view). */
export function boardQrCode(url: string): Promise<string> {
  let code = codes.get(url);
  if (!code) {
    code = QRCode.toDataURL(url, { margin: 0, width: 200, errorCorrectionLevel: 'M' });
    codes.set(url, code);
    code.catch(() => codes.delete(url));
  }
  return code;
}
