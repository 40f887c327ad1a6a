import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { countWays, countWords } from '@/lib/boards/counts';
import { wayLabelMap } from '@/lib/boards/layout';
import { issueRefusal, revisionAfter } from '@/lib/boards/record-rules';
import type { ReviewSource } from '@/lib/boards/review-page-data';
import type { IssuePreview, ReviewData } from '@/lib/boards/review-types';
import type { BoardDto } from '@/lib/boards/types';
import { readBoardAndSizing, readIssueFacts, readReviewSource, type IssueFacts } from '@/lib/dal/board-repository';
import { revisionsOf } from '@/lib/dal/revisions';
import type { FieldIssue } from '@/lib/errors';

/**
 * The review (GET /api/boards/:id/review): the board and its stored sizing first, in one
 * statement that also checks the organisation (404); then the facts, comments and revisions.
 */
export async function getReview(actor: Actor, boardId: string): Promise<ReviewData> {
  const {
    board,
    sized: { sizing, issues },
  } = await readBoardAndSizing(actor, boardId);
  const [facts, revisions] = await Promise.all([readIssueFacts(actor, boardId), revisionsOf(boardId)]);
  return { ...reviewOf(actor, board, facts, sizing, issues), sizing, revisions };
}

/**
 * The review page's source: as `getReview` in one statement, with the sizing cut to what the
 * page shows and no revisions (its diff loads its own); a stale stored sizing goes the
 * `getReview` way, which sizes and stores it.
 */
export async function getReviewSource(actor: Actor, boardId: string): Promise<ReviewSource> {
  const read = await readReviewSource(actor, boardId);
  if (read) return { ...reviewOf(actor, read.board, read.facts, read.sizing, read.issues), revisions: [] };
  const { revisions: _none, ...review } = await getReview(actor, boardId);
  return { ...review, revisions: [] };
}

function reviewOf(
  actor: Actor,
  board: BoardDto,
  facts: IssueFacts,
  sizing: ReviewSource['sizing'],
  sizingIssues: FieldIssue[],
): Omit<ReviewSource, 'revisions'> {
  const refs = Object.fromEntries(wayLabelMap(board.phases, board.ways));
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
    sizingIssues,
    refs,
    comments: facts.comments,
    issue,
  };
}
