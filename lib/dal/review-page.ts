import 'server-only';

import { QueryTypes } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { countWays, countWords } from '@/lib/boards/counts';
import { layoutWays } from '@/lib/boards/layout';
import { issueRefusal } from '@/lib/boards/record-rules';
import type { CommentDto, IssuePreview, ReviewData } from '@/lib/boards/review-types';
import { db } from '@/lib/db';
import { readBoardAndSizing } from '@/lib/dal/board-repository';
import { revisionAfter, revisionsOf } from '@/lib/dal/revisions';

type ReviewFacts = {
  orgName: string;
  allowSelfIssue: boolean;
  designChangedById: string | null;
  lastIssued: number;
  comments: CommentDto[];
};

/** A timestamp column as `Date.toISOString` writes it. */
const iso = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

/**
 * What the issue preview needs besides the board (the organisation's name and rule, who changed
 * the design last, the last revision issued) and the board's comments, oldest first (as
 * `commentsOf` answers them), in one statement.
 */
async function reviewFacts(actor: Actor, boardId: string): Promise<ReviewFacts> {
  const [row] = await db().query<ReviewFacts>(
    `SELECT o.name AS "orgName", o.allow_self_issue AS "allowSelfIssue",
       (SELECT b.design_changed_by_id FROM boards b WHERE b.id = $1) AS "designChangedById",
       COALESCE((SELECT max(r.revision) FROM board_revisions r WHERE r.board_id = $1), 0)::int AS "lastIssued",
       COALESCE((SELECT json_agg(json_build_object(
           'id', c.id, 'wayId', c.way_id, 'revision', c.revision, 'body', c.body,
           'authorName', COALESCE(u.name, 'A former member'), 'createdAt', ${iso('c.created_at')},
           'answeredAt', CASE WHEN c.answered_at IS NULL THEN NULL ELSE ${iso('c.answered_at')} END
         ) ORDER BY c.created_at, c.id)
         FROM comments c LEFT JOIN users u ON u.id = c.author_id WHERE c.board_id = $1), '[]'::json) AS comments
     FROM organisations o WHERE o.id = $2`,
    { bind: [boardId, actor.organisationId], type: QueryTypes.SELECT, raw: true },
  );
  return row ?? { orgName: '', allowSelfIssue: false, designChangedById: null, lastIssued: 0, comments: [] };
}

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
    reviewFacts(actor, boardId),
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
