import QRCode from 'qrcode';

/** A QR code of a link, as a PNG data URL (for the PDF and the browser print view). */
export function boardQrCode(url: string): Promise<string> {
  return QRCode.toDataURL(url, { margin: 0, width: 200, errorCorrectionLevel: 'M' });
}
