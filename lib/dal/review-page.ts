import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { countWays, countWords } from '@/lib/boards/counts';
import { layoutWays } from '@/lib/boards/layout';
import { issueRefusal } from '@/lib/boards/record-rules';
import type { IssuePreview, ReviewData } from '@/lib/boards/review-types';
import { readBoardAndSizing, readIssueFacts } from '@/lib/dal/board-repository';
import { revisionAfter, revisionsOf } from '@/lib/dal/revisions';

/**
 * The review page's data: the board, its stored sizing, comments and issued revisions. The
 * board and its sizing are read first, in one statement that also checks the board is the
 * caller's organisation's (404 otherwise); the facts and comments in one more, with the issued
 * revisions beside it unless `withRevisions` is false (the page does not show them: its
 * revision diff loads its own), so the page costs two statements besides the member's.
 */
export async function getReview(
  actor: Actor,
  boardId: string,
  { withRevisions = true }: { withRevisions?: boolean } = {},
): Promise<ReviewData> {
  const {
    board,
    sized: { sizing, issues },
  } = await readBoardAndSizing(actor, boardId);
  const [facts, revisions] = await Promise.all([
    readIssueFacts(actor, boardId),
    withRevisions ? revisionsOf(boardId) : [],
  ]);
  const { comments } = facts;
  const refs = Object.fromEntries(layoutWays(board.phases, board.ways).map((p) => [p.id, p.label]));
  const counts = sizing?.summary.counts;
  const issue: IssuePreview = {
    revision: revisionAfter(board.revision, facts.lastIssued),
    ways: countWords(countWays(board.phases, board.ways)),
    devices: board.ways.length,
    circuits: board.ways.filter((w) => w.circuit).length,
    verdicts: { passes: counts?.passes ?? 0, nearLimit: counts?.nearLimit ?? 0, fails: counts?.fails ?? 0 },
    refusal: issueRefusal({
      issuerId: actor.userId,
      designChangedById: facts.designChangedById,
      allowSelfIssue: facts.allowSelfIssue,
    }),
  };
  return {
    board,
    organisationName: facts.orgName,
    sizing,
    sizingIssues: issues,
    refs,
    comments,
    revisions,
    issue,
  };
}
