import 'server-only';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { readIssuedPrintRows } from '@/lib/dal/board-repository';
import { boardUrl } from '@/lib/dal/board-snapshot';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { notFound } from '@/lib/errors';

/**
 * What names an issued revision's stored print (its storage key and file name), without its
 * snapshot or sizing: the same fields of `ScheduleSource` that `storedKey` hashes.
 */
export type IssuedPrintFacts = Pick<ScheduleSource, 'boardId' | 'boardUrl' | 'revision' | 'status' | 'labels'> & {
  issued: { at: string; byName: string };
  /** The board's name in the issued snapshot (the file name). */
  name: string;
};

/**
 * The facts of the issued revision a print request names, chosen as `getScheduleSource` chooses
 * it, in one statement; null when it names no issued revision (`getScheduleSource` refuses
 * those). 404 for a board that is not the caller's organisation's.
 */
export async function issuedPrintFacts(
  actor: Actor,
  boardId: string,
  revision?: number,
): Promise<IssuedPrintFacts | null> {
  const rows = await readIssuedPrintRows(actor, boardId, revision ?? null, can(actor.role, 'schedule.print-draft'));
  if (!rows.length) throw notFound('The board');
  const [row] = rows;
  if (row.revision === null || row.issuedAt === null) return null;
  return {
    boardId,
    boardUrl: boardUrl(boardId),
    revision: row.revision,
    status: row.revision === row.boardRevision ? row.status : 'issued',
    issued: { at: row.issuedAt.toISOString(), byName: row.issuerName ?? 'A former member' },
    labels: row.labels && Object.fromEntries(row.labels.map(([id, status, note]) => [id, { status, note }])),
    name: row.name ?? '',
  };
}
