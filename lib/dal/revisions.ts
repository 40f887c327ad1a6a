import 'server-only';

import type { Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { revisionAfter } from '@/lib/boards/record-rules';
import { diffRevisions, type BoardSnapshot, type RevisionDiff } from '@/lib/boards/revision-diff';
import { sizeDesign } from '@/lib/boards/size-design';
import { liveSnapshot } from '@/lib/dal/board-snapshot';
import { findBoard, type BoardRecord } from '@/lib/dal/board-repository';
import { notFound } from '@/lib/errors';
import type { BoardResult } from '@/lib/sizing';
import { BoardRevision, User } from '@/models';
import type { BoardStatus } from '@/models/board';
import type { RevisionSummary } from '@/lib/boards/review-types';

/** The issued revisions of a board, newest first, and the board's current stage. */
export async function listRevisions(
  actor: Actor,
  boardId: string,
): Promise<{ revisions: RevisionSummary[]; current: { status: BoardStatus; revision: number } }> {
  const { status, revision } = await findBoard(actor, boardId);
  return { revisions: await revisionsOf(boardId), current: { status, revision } };
}

/** The issued revisions of a board, newest first, for a caller who has already read the board. */
export async function revisionsOf(boardId: string): Promise<RevisionSummary[]> {
  const rows = await BoardRevision.findAll({
    where: { boardId },
    attributes: ['revision', 'issuedAt', 'issuedById', 'declaration'],
    include: [{ model: User, as: 'issuedBy', attributes: ['name'] }],
    order: [['revision', 'DESC']],
  });
  return rows.map((r) => ({
    revision: r.revision,
    issuedAt: r.issuedAt.toISOString(),
    issuedByName: (r as BoardRevision & { issuedBy?: User }).issuedBy?.name ?? 'A former member',
    declaration: r.declaration,
  }));
}

/** The revision number a board in review would be issued as: its own, unless that one was issued. */
export async function nextRevision(board: BoardRecord, transaction?: Transaction): Promise<number> {
  const last =
    ((await BoardRevision.max('revision', { where: { boardId: board.id }, transaction })) as number | null) ?? 0;
  return revisionAfter(board.revision, last);
}

/** One state of a board: an issued revision, or the live board ('current'). */
type RevisionState = {
  revision: number;
  issued: { at: string; byName: string } | null;
  snapshot: BoardSnapshot;
  sizing: BoardResult | null;
};

/** An issued revision's row as a plain object. */
type RevisionRow = Pick<BoardRevision, 'revision' | 'snapshot' | 'sizing' | 'issuedAt'>;

/** An issued revision of a board with who issued it, or null. */
export async function readIssuedRevision(boardId: string, revision: number) {
  // `raw` and `nest`: a plain object (its snapshot and sizing are large), without a model instance
  const row = (await BoardRevision.findOne({
    where: { boardId, revision },
    include: [{ model: User, as: 'issuedBy', attributes: ['name'] }],
    raw: true,
    nest: true,
  })) as (RevisionRow & { issuedBy: { name: string | null } }) | null;
  if (!row) return null;
  const byName = row.issuedBy.name ?? 'A former member';
  return { row, issued: { at: row.issuedAt.toISOString(), byName } };
}

/** An issued revision, or the live board when `revision` is 'current'. */
export async function getRevision(actor: Actor, boardId: string, revision: number | 'current'): Promise<RevisionState> {
  const board = await findBoard(actor, boardId);
  if (revision === 'current') {
    const snapshot = await liveSnapshot(actor, board);
    const { sizing } = sizeDesign({ ...snapshot.settings, ways: snapshot.ways });
    return { revision: board.revision, issued: null, snapshot, sizing };
  }
  const found = await readIssuedRevision(boardId, revision);
  if (!found) throw notFound(`Revision ${revision}`);
  const { row, issued } = found;
  return {
    revision: row.revision,
    issued,
    snapshot: row.snapshot as unknown as BoardSnapshot,
    sizing: row.sizing as unknown as BoardResult,
  };
}

/** The changes from one state of a board to another. */
export async function getRevisionDiff(
  actor: Actor,
  boardId: string,
  from: number | 'current',
  to: number | 'current',
): Promise<{ from: number; to: number; toIsLive: boolean; diff: RevisionDiff }> {
  const [a, b] = await Promise.all([getRevision(actor, boardId, from), getRevision(actor, boardId, to)]);
  return { from: a.revision, to: b.revision, toIsLive: to === 'current', diff: diffRevisions(a.snapshot, b.snapshot) };
}
