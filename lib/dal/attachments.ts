import 'server-only';

import crypto from 'node:crypto';

import sharp from 'sharp';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { wayOnBoard } from '@/lib/dal/board-repository';
import { memberNames } from '@/lib/dal/members';
import { assertNotArchived, everIssued, findBoard } from '@/lib/dal/boards';
import { badRequest, HttpError, notFound } from '@/lib/errors';
import { deleteObjects, getObjectStream, putObject } from '@/lib/storage/s3';
import { Attachment } from '@/models';
import type { AttachmentDto } from '@/lib/boards/walk-types';

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

function attachmentDto(a: Attachment, uploadedByName: string): AttachmentDto {
  return {
    id: a.id,
    wayId: a.wayId,
    fileName: a.fileName,
    contentType: a.contentType,
    sizeBytes: a.sizeBytes,
    url: `/api/attachments/${a.id}`,
    thumbUrl: `/api/attachments/${a.id}/thumb`,
    uploadedByName,
    createdAt: a.createdAt.toISOString(),
  };
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

/**
 * Stores a photo of a board (or of one of its ways): checks the size and the type from the
 * bytes, makes a thumbnail, puts both in object storage and records them.
 */
export async function addAttachment(
  actor: Actor,
  boardId: string,
  input: { bytes: Uint8Array; fileName: string; wayId?: string | null },
): Promise<AttachmentDto> {
  // Ownership and the way
  const board = await findBoard(actor, boardId);
  const wayId = input.wayId || null;
  if (wayId && !(await wayOnBoard(boardId, wayId))) {
    throw badRequest([{ path: 'wayId', message: 'That way is not on this board.' }]);
  }
  // Size, then type from the bytes, then a thumbnail (which also proves the image decodes)
  if (input.bytes.byteLength === 0) throw badRequest([{ path: 'file', message: 'The file is empty.' }]);
  if (input.bytes.byteLength > MAX_PHOTO_BYTES) throw tooLarge(input.bytes.byteLength);
  const contentType = await sniffImageType(input.bytes);
  await assertNotArchived(board);
  let thumb: Buffer;
  let original: Buffer;
  try {
    original = await withoutMetadata(input.bytes, contentType);
    thumb = await sharp(input.bytes, { failOn: 'error' })
      .rotate()
      .resize(THUMB_PX, THUMB_PX, { fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer();
  } catch {
    throw notAnImage('the image could not be read (it may be damaged).');
  }
  // Object storage first; the row only once both objects are there
  const id = crypto.randomUUID();
  const prefix = `org/${board.organisationId}/boards/${boardId}/photos/${id}`;
  const storageKey = `${prefix}/original.${PHOTO_TYPES[contentType]}`;
  const thumbKey = `${prefix}/thumb.jpg`;
  await putObject(storageKey, original, contentType);
  await putObject(thumbKey, thumb, 'image/jpeg');
  try {
    const row = await db().transaction(async (transaction) => {
      const created = await Attachment.create(
        {
          id,
          organisationId: board.organisationId,
          boardId,
          wayId,
          storageKey,
          thumbKey,
          contentType,
          sizeBytes: original.byteLength,
          fileName: input.fileName.slice(0, 200),
          uploadedById: actor.userId,
        },
        { transaction },
      );
      await audit(actor, 'attachment.added', { attachmentId: id, wayId }, { boardId, transaction });
      return created;
    });
    return attachmentDto(row, actor.name);
  } catch (err) {
    await deleteObjects([storageKey, thumbKey]).catch(() => undefined);
    throw err;
  }
}

/** The photos of a board, oldest first. */
export async function listAttachments(actor: Actor, boardId: string): Promise<AttachmentDto[]> {
  await findBoard(actor, boardId);
  const rows = await Attachment.findAll({
    where: { boardId, organisationId: actor.organisationId, withdrawnAt: null },
    order: [['createdAt', 'ASC']],
  });
  const names = await memberNames(rows.map((r) => r.uploadedById));
  return rows.map((r) => attachmentDto(r, names.get(r.uploadedById) ?? 'A former member'));
}

async function findAttachment(actor: Actor, id: string): Promise<Attachment> {
  db();
  const row = await Attachment.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!row) throw notFound('The photo');
  // A deleted draft board's photos go with it (until an undo brings them back)
  await findBoard(actor, row.boardId).catch(() => {
    throw notFound('The photo');
  });
  return row;
}

/** A photo's bytes (or its thumbnail's) as a stream, for members of its organisation only. */
export async function openAttachment(
  actor: Actor,
  id: string,
  variant: 'original' | 'thumb',
): Promise<{ body: ReadableStream<Uint8Array>; length?: number; contentType: string; fileName: string }> {
  const row = await findAttachment(actor, id);
  const key = variant === 'thumb' ? (row.thumbKey ?? row.storageKey) : row.storageKey;
  const found = await getObjectStream(key);
  if (!found) throw notFound('The photo');
  return {
    body: found.body,
    length: found.length,
    contentType: variant === 'thumb' && row.thumbKey ? 'image/jpeg' : row.contentType,
    fileName: row.fileName,
  };
}

/**
 * Removes a photo from its board. The photo of a board that was ever issued is a record: it is
 * withdrawn (no longer listed) and kept, row and objects; otherwise the photo and its objects
 * are removed.
 */
export async function deleteAttachment(actor: Actor, id: string): Promise<{ effect: 'deleted' | 'withdrawn' }> {
  const row = await findAttachment(actor, id);
  const effect = await db().transaction(async (transaction) => {
    const board = await findBoard(actor, row.boardId, { transaction, lock: true });
    await assertNotArchived(board, transaction);
    if (row.withdrawnAt) throw notFound('The photo');
    if (await everIssued(row.boardId, transaction)) {
      await row.update({ withdrawnAt: new Date(), withdrawnById: actor.userId }, { transaction });
      await audit(
        actor,
        'attachment.withdrawn',
        { attachmentId: id, wayId: row.wayId },
        { boardId: row.boardId, transaction },
      );
      return 'withdrawn' as const;
    }
    await audit(actor, 'attachment.deleted', { attachmentId: id }, { boardId: row.boardId, transaction });
    await row.destroy({ transaction });
    return 'deleted' as const;
  });
  if (effect === 'deleted') {
    await deleteObjects([row.storageKey, row.thumbKey].filter((k): k is string => !!k)).catch(() => undefined);
  }
  return { effect };
}
