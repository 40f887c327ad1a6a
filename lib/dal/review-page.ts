import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { countWays, countWords } from '@/lib/boards/counts';
import { layoutWays } from '@/lib/boards/layout';
import type { IssuePreview, ReviewData } from '@/lib/boards/review-types';
import { organisationName } from '@/lib/dal/board-snapshot';
import { readSizedBoard } from '@/lib/dal/board-repository';
import { findBoard, getBoard } from '@/lib/dal/boards';
import { listComments } from '@/lib/dal/comments';
import { issueRefusalFor } from '@/lib/dal/issue-and-return';
import { listRevisions, nextRevision } from '@/lib/dal/revisions';

/** The review page's data: the board, its sizing, comments and issued revisions. */
export async function getReview(actor: Actor, boardId: string): Promise<ReviewData> {
  const board = await getBoard(actor, boardId);
  const [orgName, comments, revisions, row, { sizing, issues }] = await Promise.all([
    organisationName(actor),
    listComments(actor, boardId),
    listRevisions(actor, boardId),
    findBoard(actor, boardId),
    readSizedBoard(actor, boardId),
  ]);
  const refs = Object.fromEntries(layoutWays(board.phases, board.ways).map((p) => [p.id, p.label]));
  const counts = sizing?.summary.counts;
  const issue: IssuePreview = {
    revision: await nextRevision(row),
    ways: countWords(countWays(board.phases, board.ways)),
    devices: board.ways.length,
    circuits: board.ways.filter((w) => w.circuit).length,
    verdicts: { passes: counts?.passes ?? 0, nearLimit: counts?.nearLimit ?? 0, fails: counts?.fails ?? 0 },
    refusal: await issueRefusalFor(actor, row),
  };
  return {
    board,
    organisationName: orgName,
    sizing,
    sizingIssues: issues,
    refs,
    comments,
    revisions,
    issue,
  };
}
