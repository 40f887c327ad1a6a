import 'server-only';

import crypto from 'node:crypto';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { findBoard, wayOnBoard } from '@/lib/dal/board-repository';
import { memberNames } from '@/lib/dal/members';
import { assertNotArchived, everIssued, findWritableBoard } from '@/lib/dal/boards';
import { badRequest, notFound } from '@/lib/errors';
import { MAX_PHOTO_BYTES, PHOTO_TYPES, sniffImageType, storedImages, tooLarge } from '@/lib/storage/photo-image';
import { deleteObjects, getObjectStream, putObject } from '@/lib/storage/s3';
import { Attachment } from '@/models';
import type { AttachmentDto } from '@/lib/boards/walk-types';

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
  const { original, thumb } = await storedImages(input.bytes, contentType);
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
  const { boardId, wayId } = row;
  const effect = await db().transaction(async (transaction) => {
    await findWritableBoard(actor, boardId, transaction);
    if (row.withdrawnAt) throw notFound('The photo');
    if (await everIssued(boardId, transaction)) {
      await row.update({ withdrawnAt: new Date(), withdrawnById: actor.userId }, { transaction });
      await audit(actor, 'attachment.withdrawn', { attachmentId: id, wayId }, { boardId, transaction });
      return 'withdrawn' as const;
    }
    await audit(actor, 'attachment.deleted', { attachmentId: id }, { boardId, transaction });
    await row.destroy({ transaction });
    return 'deleted' as const;
  });
  if (effect === 'deleted') {
    await deleteObjects([row.storageKey, row.thumbKey].filter((k): k is string => !!k)).catch(() => undefined);
  }
  return { effect };
}
