import 'server-only';

import { QueryTypes } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { boardUrl } from '@/lib/dal/board-snapshot';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { notFound } from '@/lib/errors';
import type { BoardStatus } from '@/models/board';
import type { LabelStatus } from '@/models/way';

/**
 * What names an issued revision's stored print (its storage key and file name), without its
 * snapshot or sizing: the same fields of `ScheduleSource` that `storedKey` hashes.
 */
export type IssuedPrintFacts = Pick<ScheduleSource, 'boardId' | 'boardUrl' | 'revision' | 'status' | 'labels'> & {
  issued: { at: string; byName: string };
  /** The board's name in the issued snapshot (the file name). */
  name: string;
};

type Row = {
  status: BoardStatus;
  boardRevision: number;
  revision: number | null;
  issuedAt: Date | null;
  issuerName: string | null;
  name: string | null;
  labels: [string, LabelStatus, string][] | null;
};

/**
 * The facts of the issued revision a print request names, in one statement, or null when it
 * names no issued revision (a draft, a revision that does not exist, a board never issued:
 * `getScheduleSource` decides those, with their refusals). The revision is chosen as
 * `getScheduleSource` chooses it: the one asked for; else the board's own when it is issued
 * or the caller may print drafts; else the last issued. The walk's label results count only
 * for the board's current issued revision, for the ways in its snapshot. 404 for a board
 * that is not the caller's organisation's.
 */
export async function issuedPrintFacts(
  actor: Actor,
  boardId: string,
  revision?: number,
): Promise<IssuedPrintFacts | null> {
  const rows = await db().query<Row>(
    `SELECT b.status, b.revision AS "boardRevision", r.revision, r.issued_at AS "issuedAt", u.name AS "issuerName",
       r.snapshot->'settings'->>'name' AS name,
       CASE WHEN b.status IN ('issued', 'labels-matched') AND r.revision = b.revision THEN COALESCE((
         SELECT json_agg(json_build_array(w.id, w.label_status, w.label_note))
         FROM ways w WHERE w.board_id = b.id
           AND w.id::text IN (SELECT e->>'id' FROM jsonb_array_elements(r.snapshot->'ways') e)
       ), '[]'::json) END AS labels
     FROM boards b
     LEFT JOIN board_revisions r ON r.board_id = b.id AND r.revision = CASE
       WHEN $3::int IS NOT NULL THEN $3::int
       WHEN b.status IN ('issued', 'labels-matched') OR $4::boolean THEN b.revision
       ELSE (SELECT max(x.revision) FROM board_revisions x WHERE x.board_id = b.id) END
     LEFT JOIN users u ON u.id = r.issued_by_id
     WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    {
      bind: [boardId, actor.organisationId, revision ?? null, can(actor.role, 'schedule.print-draft')],
      type: QueryTypes.SELECT,
      raw: true,
    },
  );
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
