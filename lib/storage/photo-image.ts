import 'server-only';

import sharp from 'sharp';

import { HttpError } from '@/lib/errors';

/**
 * A photo's bytes checked and made ready to store (lib/dal/attachments.ts records them): the
 * size limit, the image type sniffed from the content, the copy kept without the camera's
 * metadata and its thumbnail.
 */

/** Largest photo accepted, bytes. */
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;

/** Image types accepted, as sniffed from the bytes, with the extension they are stored under. */
export const PHOTO_TYPES: Record<string, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/gif': 'gif',
  'image/avif': 'avif',
};

/** Longest side of a thumbnail, px. */
const THUMB_PX = 320;

/**
 * The photo as stored: decoded and encoded again in its own format, turned upright first
 * (the orientation tag goes with the rest), so that none of the camera's metadata is kept:
 * no EXIF (GPS position, device serial, times), XMP or IPTC. Only the colour profile stays.
 * sharp writes no metadata unless asked to (https://sharp.pixelplumbing.com/api-output#keepmetadata).
 */
async function withoutMetadata(bytes: Uint8Array, contentType: string): Promise<Buffer> {
  const animated = contentType === 'image/gif' || contentType === 'image/webp';
  const image = sharp(bytes, { failOn: 'error', animated }).keepIccProfile();
  const upright = animated ? image : image.rotate();
  switch (contentType) {
    case 'image/jpeg':
      return upright.jpeg({ quality: 92, chromaSubsampling: '4:4:4' }).toBuffer();
    case 'image/png':
      return upright.png().toBuffer();
    case 'image/webp':
      return upright.webp({ quality: 92 }).toBuffer();
    case 'image/gif':
      return upright.gif().toBuffer();
    default:
      return upright.avif({ quality: 70 }).toBuffer();
  }
}

/** 413 naming the field, for a file over the limit. */
export function tooLarge(sizeBytes?: number): HttpError {
  const size = sizeBytes ? ` (${(sizeBytes / 1024 / 1024).toFixed(1)} MB)` : '';
  const message = `The photo is too large${size}: at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`;
  return new HttpError(413, message, { issues: [{ path: 'file', message }] });
}

function notAnImage(detail: string): HttpError {
  const message = `The file is not a photo we can take: ${detail} Send a JPEG, PNG, WebP, GIF or AVIF image.`;
  return new HttpError(415, message, { issues: [{ path: 'file', message }] });
}

/** The image type of some bytes, sniffed from their content (never from the name), or a 415. */
export async function sniffImageType(bytes: Uint8Array): Promise<string> {
  // file-type is an ES module only
  const { fileTypeFromBuffer } = await import('file-type');
  const found = await fileTypeFromBuffer(bytes);
  if (!found) throw notAnImage('its content is not a known file type.');
  if (found.mime === 'image/heic' || found.mime === 'image/heif') {
    throw notAnImage('HEIC photos are not supported (set the camera to “most compatible”).');
  }
  if (!PHOTO_TYPES[found.mime]) throw notAnImage(`its content is ${found.mime}.`);
  return found.mime;
}

/** The photo as stored (`withoutMetadata`) and its thumbnail; 415 for an image that does not decode. */
export async function storedImages(
  bytes: Uint8Array,
  contentType: string,
): Promise<{ original: Buffer; thumb: Buffer }> {
  try {
    const original = await withoutMetadata(bytes, contentType);
    const thumb = await sharp(bytes, { failOn: 'error' })
      .rotate()
      .resize(THUMB_PX, THUMB_PX, { fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer();
    return { original, thumb };
  } catch {
    throw notAnImage('the image could not be read (it may be damaged).');
  }
}
