import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { countWays, countWords } from '@/lib/boards/counts';
import { wayLabelMap } from '@/lib/boards/layout';
import { transition } from '@/lib/boards/lifecycle';
import { sizeDesign } from '@/lib/boards/size-design';
import type { BoardDto } from '@/lib/boards/types';
import { db } from '@/lib/db';
import { liveSnapshot } from '@/lib/dal/board-snapshot';
import { writeBoard } from '@/lib/dal/board-repository';
import { assertVersion, findWritableBoard } from '@/lib/dal/boards';
import { queueNotices } from '@/lib/dal/notices';
import { env } from '@/lib/env';
import { conflict, unprocessable } from '@/lib/errors';
import type { ReviewRequestedFacts } from '@/lib/mail/templates';
import { nameWaysIn } from '@/lib/names';
import type { FailingBoardCheck, FailingWay } from '@/lib/boards/review-types';

/**
 * Sends a draft board for review, with its row locked: the stored board is sized again, and a
 * failing way refuses it (422, listing the ways); a failing board-level check does not (the
 * inspector judges it, and the e-mail names it). The version moves on, so an editor holding the
 * old one cannot overwrite the board under review; the inspectors are e-mailed through the
 * outbox. `expectedVersion` (409 if stale) makes what goes for review what the designer saw.
 */
export async function submitBoard(actor: Actor, boardId: string, expectedVersion?: number): Promise<BoardDto> {
  return db().transaction(async (transaction) => {
    // The board, locked, in the caller's organisation, not archived; its stage first (a board
    // already in review or issued says so, whatever version the caller held), then the version
    const board = await findWritableBoard(actor, boardId, transaction);
    const step = transition(board.status, 'submit', { revision: board.revision });
    if (step.refused) throw conflict(step.message, { status: board.status, revision: board.revision });
    assertVersion(board, expectedVersion);

    // Size the stored board exactly as the sizing route does and as issuing freezes it (with what
    // the site's tree gives it: lib/dal/board-snapshot.ts liveSnapshot)
    const { settings, ways } = await liveSnapshot(actor, board, transaction);
    const { sizing: sized, issues } = sizeDesign({ ...settings, ways });
    if (!sized) {
      throw unprocessable('The stored board is not complete enough to size; open it in the editor and save it again.', {
        failing: [],
        boardChecks: issues.map(({ path, message }) => ({ code: 'input', message, reference: path })),
      });
    }

    // Every failing way and board-level check, in rail order with its way reference
    const labels = wayLabelMap(board.phases, ways);
    const byId = new Map(ways.map((w) => [w.id, w]));
    const failing: FailingWay[] = sized.ways
      .filter((w) => w.result?.verdict === 'fails')
      .map((w) => ({
        wayId: w.id,
        label: labels.get(w.id) ?? null,
        serves: byId.get(w.id)?.circuit?.serves ?? '',
        problems: (w.result?.checks ?? []).filter((c) => !c.ok).map((c) => nameWaysIn(c.message, labels)),
      }));
    const boardChecks: FailingBoardCheck[] = sized.summary.checks
      .filter((c) => !c.ok)
      .map(({ code, message, reference }) => ({ code, message: nameWaysIn(message, labels), reference }));
    if (failing.length) {
      const n = failing.length;
      throw unprocessable(
        `The board cannot go for review: ${n} way${n === 1 ? ' fails' : 's fail'}. Mend ${n === 1 ? 'it' : 'them'} and send it again.`,
        { failing, boardChecks },
      );
    }

    // Status (the database moves the version on, so an editor holding the old one cannot save), audit
    const events = step.audit
      ? [{ action: step.audit, details: { from: step.from, to: step.to, revision: board.revision } }]
      : [];
    const written = await writeBoard(actor, board, { set: { status: step.to }, events }, transaction);

    // The organisation's inspectors hear of it through the outbox (sent once committed)
    const reviewRequested: ReviewRequestedFacts = {
      appUrl: env().APP_URL,
      boardId: board.id,
      boardName: board.name,
      siteName: written.siteName ?? null,
      revision: board.revision,
      senderName: actor.name,
      counts: countWords(countWays(board.phases, ways)),
      boardChecks,
    };
    await queueNotices(step, board, { 'review-requested': reviewRequested }, transaction);
    return written;
  });
}
