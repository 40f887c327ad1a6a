import 'server-only';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { isIssued } from '@/lib/boards/lifecycle';
import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import { boardUrl, liveSnapshot } from '@/lib/dal/board-snapshot';
import { findBoard, readLabelChecks, readSizedBoard } from '@/lib/dal/board-repository';
import { forbidden, notFound, type FieldIssue } from '@/lib/errors';
import type { BoardResult } from '@/lib/sizing';
import { readIssuedRevision } from '@/lib/dal/revisions';
import { BoardRevision } from '@/models';
import type { BoardStatus } from '@/models/board';
import type { LabelStatus } from '@/models/way';

/** What a printed schedule (or label strip) is made from. */
export type ScheduleSource = {
  boardId: string;
  boardUrl: string;
  snapshot: BoardSnapshot;
  sizing: BoardResult | null;
  sizingIssues: FieldIssue[];
  revision: number;
  status: BoardStatus;
  /** True for an issued revision (frozen), false for the live draft. */
  frozen: boolean;
  issued: { at: string; byName: string } | null;
  /** The label walk's results, when a walk applies to this revision. */
  labels: Record<string, { status: LabelStatus; note: string }> | null;
  updatedAt: string;
};

/**
 * The board state to print. Without `revision`: the issued revision of an issued board
 * (labels matched or not), else the live draft. Only roles that may print drafts
 * ('schedule.print-draft': not installers) print the live draft; the others print issued
 * revisions only (a board never issued is refused).
 */
export async function getScheduleSource(actor: Actor, boardId: string, revision?: number): Promise<ScheduleSource> {
  const board = await findBoard(actor, boardId);
  const draftsAllowed = can(actor.role, 'schedule.print-draft');
  const issuedNow = isIssued(board.status);
  let target = revision;
  if (target === undefined) {
    if (issuedNow || draftsAllowed) target = board.revision;
    else {
      target = ((await BoardRevision.max('revision', { where: { boardId } })) as number | null) ?? undefined;
      if (target === undefined) throw forbidden('print a board that has not been issued');
    }
  }
  const url = boardUrl(boardId);
  const found = await readIssuedRevision(boardId, target);
  if (found) {
    const { row, issued } = found;
    const snapshot = row.snapshot as unknown as BoardSnapshot;
    // The walk checks the board as built, which is the current issued revision
    let labels: ScheduleSource['labels'] = null;
    if (issuedNow && row.revision === board.revision) {
      const checks = await readLabelChecks(boardId);
      labels = Object.fromEntries(snapshot.ways.flatMap((w) => (checks.has(w.id) ? [[w.id, checks.get(w.id)!]] : [])));
    }
    return {
      boardId,
      boardUrl: url,
      snapshot,
      sizing: row.sizing as unknown as BoardResult,
      sizingIssues: [],
      revision: row.revision,
      status: row.revision === board.revision ? board.status : 'issued',
      frozen: true,
      issued,
      labels,
      updatedAt: row.issuedAt.toISOString(),
    };
  }
  if (target !== board.revision) throw notFound(`Revision ${target}`);
  if (!draftsAllowed) throw forbidden('print a board that has not been issued');
  const [snapshot, { sizing, issues }] = await Promise.all([
    liveSnapshot(actor, board),
    readSizedBoard(actor, boardId),
  ]);
  return {
    boardId,
    boardUrl: url,
    snapshot,
    sizing,
    sizingIssues: issues,
    revision: board.revision,
    status: board.status,
    frozen: false,
    issued: null,
    labels: null,
    updatedAt: board.updatedAt.toISOString(),
  };
}
