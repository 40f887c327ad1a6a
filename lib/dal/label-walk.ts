import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { wayLabelMap } from '@/lib/boards/layout';
import { labelCheckEvent, labelsEvent, transition } from '@/lib/boards/lifecycle';
import { labelTextOf } from '@/lib/boards/revision-diff';
import { deviceName } from '@/lib/names';
import { db } from '@/lib/db';
import { listAttachments } from '@/lib/dal/attachments';
import { audit } from '@/lib/dal/audit';
import { memberNames } from '@/lib/dal/members';
import { findBoard, readWayRows, writeBoard, writeLabelCheck } from '@/lib/dal/board-repository';
import { assertNotArchived } from '@/lib/dal/boards';
import { conflict } from '@/lib/errors';
import { Site } from '@/models';
import type { BoardStatus } from '@/models/board';
import type { LabelStatus } from '@/models/way';
import type { WalkProgress, WalkData } from '@/lib/boards/walk-types';

/** Counts of a walk's results. */
function walkProgress(statuses: LabelStatus[]): WalkProgress {
  const count = (s: LabelStatus) => statuses.filter((x) => x === s).length;
  return {
    total: statuses.length,
    checked: statuses.length - count('unchecked'),
    matches: count('matches'),
    wrong: count('wrong'),
    missing: count('missing'),
  };
}

/** The walk of a board: every device on the rail in rail order, with its result and photos. */
export async function getWalk(actor: Actor, boardId: string): Promise<WalkData> {
  const board = await findBoard(actor, boardId);
  const [site, ways, photos] = await Promise.all([
    Site.findByPk(board.siteId, { attributes: ['name'] }),
    readWayRows(boardId),
    listAttachments(actor, boardId),
  ]);
  const refs = wayLabelMap(board.phases, ways);
  const names = await memberNames(ways.map((w) => w.labelCheckedById));
  // The ways come in rail order
  const walkWays = ways.map((w) => ({
    id: w.id,
    ref: refs.get(w.id) ?? null,
    labelText: labelTextOf(w),
    device: deviceName(w.device),
    modules: Math.max(1, w.device.modules),
    rail: w.rail,
    status: w.labelStatus,
    note: w.labelNote,
    checkedByName: w.labelCheckedById ? (names.get(w.labelCheckedById) ?? null) : null,
    checkedAt: w.labelCheckedAt ? w.labelCheckedAt.toISOString() : null,
    photos: photos.filter((p) => p.wayId === w.id),
  }));
  return {
    boardId,
    name: board.name,
    siteName: site?.name ?? '',
    location: board.location,
    status: board.status,
    revision: board.revision,
    ways: walkWays,
    progress: walkProgress(walkWays.map((w) => w.status)),
    boardPhotos: photos.filter((p) => !p.wayId),
  };
}

/**
 * Records what the walker found at one way. When every way's label matches the board
 * reaches the stage labels-matched; such a board with a label found wrong or missing goes back to issued.
 */
export async function recordLabel(
  actor: Actor,
  boardId: string,
  wayId: string,
  input: { status: Exclude<LabelStatus, 'unchecked'>; note?: string; confirmStateChange?: boolean },
): Promise<{ boardStatus: BoardStatus; progress: WalkProgress }> {
  return db().transaction(async (transaction) => {
    // Lock the board so that saves and other walkers wait their turn
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    // The walk is for issued boards (lib/boards/lifecycle.ts); this label alone would decide the
    // board's labels when the others all match, so it asks the table as if it did
    const ahead = transition(board.status, labelCheckEvent(input.status), { revision: board.revision });
    if (ahead.refused) throw conflict(ahead.message);
    await assertNotArchived(board, transaction);
    // A board whose labels were all confirmed changes state only when the walker said so
    if (ahead.needsConfirmation && !input.confirmStateChange) {
      throw conflict(
        `Every label on this board was confirmed. Recording this one as ${input.status} takes the board from labels matched on site back to issued; confirm to go on.`,
        { needsConfirmation: true, from: ahead.from, to: ahead.to },
      );
    }
    // Record the result, then every way's result after it
    const [status, note] = [input.status, input.note?.trim() ?? ''];
    const check = { labelStatus: status, labelNote: note, labelCheckedById: actor.userId, labelCheckedAt: new Date() };
    const statuses = await writeLabelCheck(boardId, wayId, check, transaction);
    // The audit trail keeps every check with its note (a later revision may remove the way)
    await audit(actor, 'label.checked', { wayId, status, note, revision: board.revision }, { boardId, transaction });
    // Labels matched when every label matches; back to issued otherwise (lib/boards/lifecycle.ts)
    const progress = walkProgress(statuses);
    const step = transition(board.status, labelsEvent(statuses), { revision: board.revision });
    if (step.refused || step.to === board.status) return { boardStatus: board.status, progress };
    // The way that took the labels back is kept with the event
    const details =
      step.audit === 'board.labels-unmatched' ? { revision: board.revision, wayId } : { revision: board.revision };
    const events = step.audit ? [{ action: step.audit, details }] : [];
    await writeBoard(actor, board, { set: { status: step.to }, events }, transaction);
    return { boardStatus: step.to, progress };
  });
}

/** The labels of a walk found wrong or missing, in rail order, for the board page and the designer. */
export function labelProblems(walk: WalkData) {
  return walk.ways.flatMap(({ id, ref, status, note }) =>
    status === 'wrong' || status === 'missing' ? [{ wayId: id, ref, status, note }] : [],
  );
}
