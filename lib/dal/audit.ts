import { Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { wayLabelMap } from '@/lib/boards/layout';
import { findBoard, readWays } from '@/lib/dal/board-repository';
import { memberNames } from '@/lib/dal/members';
import { db, type Statement } from '@/lib/db';
import { AuditEvent } from '@/models';
import type { AuditPage } from '@/lib/audit-types';

export type AuditAction =
  | 'board.created'
  | 'board.renamed'
  | 'board.deleted'
  | 'board.saved'
  | 'way.added'
  | 'way.removed'
  | 'way.moved'
  | 'way.changed'
  | 'board.status'
  | 'board.comment'
  | 'label.checked'
  | 'site.created'
  | 'site.renamed'
  | 'site.deleted'
  | 'member.invited'
  | 'member.changed'
  | 'schedule.emailed'
  | 'review.approved'
  | 'review.returned'
  | 'board.labels-matched'
  | 'board.labels-unmatched'
  /** Written before migration 0007; the trail keeps them as they were. */
  | 'board.verified'
  | 'board.unverified'
  | 'attachment.added'
  | 'attachment.deleted'
  | 'attachment.withdrawn'
  | 'board.archived'
  | 'board.restored'
  | 'board.undeleted'
  | 'site.archived'
  | 'site.restored'
  | 'comments.answered'
  | 'organisation.changed'
  /** Site supply tree (migration 0009): a board's feed, its carried supply, the site's origin. */
  | 'board.supply-origin'
  | 'board.feed-changed'
  | 'board.supply-changed'
  | 'site.origin-changed'
  | 'site.pack-emailed';

/** The details of a board's latest event of one action (null: none), inside the caller's transaction. */
export async function latestEventDetails(
  boardId: string,
  action: AuditAction,
  transaction: Transaction,
): Promise<Record<string, unknown> | null> {
  const event = await AuditEvent.findOne({
    where: { boardId, action },
    order: [['createdAt', 'DESC']],
    attributes: ['details'],
    transaction,
  });
  return (event?.details as Record<string, unknown> | undefined) ?? null;
}

/** Appends one event to the audit trail, inside the caller's transaction when given. */
export async function audit(
  actor: Actor,
  action: AuditAction,
  details: Record<string, unknown>,
  opts: { boardId?: string | null; transaction?: Transaction } = {},
): Promise<void> {
  await auditMany(actor, [{ action, details }], opts);
}

/** One history entry of `auditMany`. */
export type AuditEntry = { action: AuditAction; details: Record<string, unknown>; boardId?: string | null };

/**
 * Appends several events in a single insert (a save records one per way touched; a re-sized site
 * one per board whose supply changed): each event's own `boardId` when it has one, else `opts.boardId`.
 */
export async function auditMany(
  actor: Actor,
  events: readonly AuditEntry[],
  opts: { boardId?: string | null; transaction?: Transaction } = {},
): Promise<void> {
  const statement = auditStatement(actor, events, opts.boardId);
  if (statement) await db().query(statement.sql, { bind: statement.bind, transaction: opts.transaction });
}

/** The insert of `auditMany` (null for no events), to send with other writes (lib/db.ts `asOneStatement`). */
export function auditStatement(
  actor: Actor,
  events: readonly AuditEntry[],
  boardId: string | null = null,
): Statement | null {
  if (!events.length) return null;
  // Each event stamped with the clock (two in one transaction keep their order)
  const rows = events.map((e) => ({
    board_id: e.boardId !== undefined ? e.boardId : boardId,
    action: e.action,
    details: e.details,
  }));
  return {
    sql: `INSERT INTO audit_events (organisation_id, board_id, user_id, action, details, created_at)
     SELECT $1::uuid, e.board_id, $2::uuid, e.action, e.details, clock_timestamp()
     FROM ROWS FROM (json_to_recordset($3::json) AS (board_id uuid, action text, details jsonb))
       WITH ORDINALITY AS e(board_id, action, details, n)
     ORDER BY e.n`,
    bind: [actor.organisationId, actor.userId, JSON.stringify(rows)],
  };
}

/** Most events one page holds. */
export const AUDIT_PAGE_MAX = 200;

/**
 * A board's audit trail, newest first, with the name of who did each thing. Scoped to the
 * caller's organisation (another organisation's board is 404). `before` is the id of the
 * oldest event already shown, for the next page.
 */
export async function listAudit(
  actor: Actor,
  boardId: string,
  opts: { before?: string; limit?: number; actions?: readonly string[] } = {},
): Promise<AuditPage> {
  // Ownership: the board must belong to the caller's organisation (deleted or not)
  const board = await findBoard(actor, boardId, { deleted: true });
  // One page of events, plus one to know whether there is more
  const limit = Math.min(Math.max(opts.limit ?? 100, 1), AUDIT_PAGE_MAX);
  const events = await AuditEvent.findAll({
    where: {
      boardId,
      organisationId: actor.organisationId,
      ...(opts.before ? { id: { [Op.lt]: opts.before } } : {}),
      ...(opts.actions?.length ? { action: { [Op.in]: [...opts.actions] } } : {}),
    },
    order: [['id', 'DESC']],
    limit: limit + 1,
  });
  const page = events.slice(0, limit);
  // Who: names of the members involved, from the same organisation only
  const names = await memberNames(
    page.map((e) => e.userId),
    actor.organisationId,
  );
  // Where: the current printed reference of each way named by an event
  const labels = wayLabelMap(board.phases, await readWays(boardId));
  return {
    entries: page.map((e) => {
      const wayId = typeof e.details?.wayId === 'string' ? e.details.wayId : null;
      return {
        id: String(e.id),
        action: e.action,
        details: e.details ?? {},
        userName: e.userId ? (names.get(e.userId) ?? null) : null,
        createdAt: e.createdAt.toISOString(),
        wayLabel: wayId ? (labels.get(wayId) ?? null) : null,
      };
    }),
    nextBefore: events.length > limit ? String(page[page.length - 1].id) : null,
  };
}
