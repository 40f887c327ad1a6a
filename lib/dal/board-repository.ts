import 'server-only';

import { createHash } from 'node:crypto';

import { LRUCache } from 'lru-cache';
import { cache } from 'react';
import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { countWays, type CountedWay } from '@/lib/boards/counts';
import { sizeDesign, type SizedBoard } from '@/lib/boards/size-design';
import {
  wayInputOf,
  type BoardCreateInput,
  type BoardFeed,
  type BoardDto,
  type BoardRow,
  type BoardSummary,
  type WayInput,
  type WayRow,
} from '@/lib/boards/schemas';
import { db, type Statement } from '@/lib/db';
import { auditMany, type AuditAction } from '@/lib/dal/audit';
import { afterTreeWrite, beforeTreeWrite, type TreeWriteRequest } from '@/lib/dal/site-feed';
import { resizeSiteOfStaleBoard } from '@/lib/dal/site-tree';
import type { DerivedSupply } from '@/lib/sites/tree-types';
import { notFound, type FieldIssue } from '@/lib/errors';
import { ENGINE_REVISION, type BoardResult } from '@/lib/sizing';
import { deepFreeze } from '@/lib/sizing/validate';
import type { BoardStatus, LabelStatus } from '@/lib/domain';
import { sizingOutcome } from '@/lib/supply';
import { REVIEW_CUT, reviewSizingOf, type ReviewSizing } from '@/lib/boards/review-page-data';
import type { ArchiveState, CommentDto } from '@/lib/boards/review-types';
import type { TreeBoard } from '@/lib/supply/size-tree';
import { Board, Way } from '@/models';

/**
 * The board repository: the one module that reads and writes the `boards`, `ways` and
 * `board_sizings` tables for the board's design. Reads answer the DTO of lib/boards/schemas.ts,
 * built by PostgreSQL from one column list (`BOARD_DTO_JSON`); every write goes through
 * `writeBoard`, which writes the row, the ways, the audit rows and the stored sizing in one
 * transaction. The database raises `version` and `updated_at` on every write (migration 0008).
 */

/** A timestamp column as the ISO text `Date.toISOString` gives (the DTO's form). */
const isoSql = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

/** The board's feed (lib/boards/schemas.ts boardFeedSchema) of boards row `b`. */
const FEED_JSON = `CASE WHEN b.fed_from_way_id IS NULL THEN json_build_object('from', 'origin') ELSE json_build_object(
  'from', 'way', 'boardId', (SELECT fw.board_id FROM ways fw WHERE fw.id = b.fed_from_way_id), 'wayId', b.fed_from_way_id,
  'designCurrentOverride', CASE WHEN b.sub_main_design_current_a IS NULL THEN NULL ELSE json_build_object(
    'amps', b.sub_main_design_current_a::float8, 'reason', b.sub_main_design_current_reason) END,
  'upstreamRcdTimeDelayed', b.upstream_rcd_time_delayed) END`;

/** The settings, status and version of boards row `b` (json_build_object's arguments). */
const SETTINGS_JSON = `'name', b.name, 'location', b.location, 'phases', b.phases, 'supply', b.supply,
  'incoming', b.incoming, 'enclosureModules', b.enclosure_modules, 'rails', b.rails,
  'dwelling', b.dwelling, 'conditionalRatingKa', b.conditional_rating_ka, 'status', b.status, 'version', b.version`;

/** The ways of boards row `b` in rail order, their design fields and `more` (json_build_object's arguments). */
const waysJson = (more = '') => `COALESCE((
    SELECT json_agg(json_build_object(
      'id', w.id, 'rail', w.rail, 'position', w.position, 'device', w.device, 'circuit', w.circuit${more}
    ) ORDER BY w.rail, w.position)
    FROM ways w WHERE w.board_id = b.id
  ), '[]'::json)`;

/** The board DTO of boards row `b`, its site's name and its ways in rail order, as JSON text. */
const BOARD_DTO_JSON = `json_build_object(
  'id', b.id, 'siteId', b.site_id, 'siteName', (SELECT s.name FROM sites s WHERE s.id = b.site_id),
  ${SETTINGS_JSON}, 'revision', b.revision, 'updatedAt', ${isoSql('b.updated_at')},
  'ways', ${waysJson(`, 'labelStatus', w.label_status, 'labelNote', w.label_note`)},
  'feed', ${FEED_JSON}, 'derivedSupply', (SELECT bs.carried FROM board_sizings bs WHERE bs.board_id = b.id)
)::text`;

/** One statement with bind parameters ($1…), its rows as plain objects. */
async function select<R extends object>(sql: string, bind: unknown[], transaction?: Transaction): Promise<R[]> {
  return db().query<R>(sql, { bind, type: QueryTypes.SELECT, transaction, raw: true });
}

type ReadOptions = { transaction?: Transaction; deleted?: boolean };

/** The caller's organisation's board with its ways (404 otherwise, and for a deleted one). */
export async function readBoard(actor: Actor, boardId: string, opts: ReadOptions = {}): Promise<BoardDto> {
  const rows = await select<{ dto: string }>(
    `SELECT ${BOARD_DTO_JSON} AS dto FROM boards b
     WHERE b.id = $1 AND b.organisation_id = $2 ${opts.deleted ? '' : 'AND b.deleted_at IS NULL'}`,
    [boardId, actor.organisationId],
    opts.transaction,
  );
  if (!rows.length) throw notFound('The board');
  return JSON.parse(rows[0].dto) as BoardDto;
}

/** A boards row as read (a plain object: every write goes through this module). */
export type BoardRecord = Readonly<BoardRow>;

/**
 * The board row of the caller's organisation, or 404 (never another organisation's, nor a
 * deleted one unless `deleted` asks for it: undo needs it); `lock` locks it for a change.
 */
export async function findBoard(
  actor: Actor,
  boardId: string,
  opts: ReadOptions & { lock?: boolean } = {},
): Promise<BoardRecord> {
  // `raw`: the row as a plain object, without building a model instance of it
  const board = await Board.findOne({
    where: { id: boardId, organisationId: actor.organisationId, ...(opts.deleted ? {} : { deletedAt: null }) },
    transaction: opts.transaction,
    lock: opts.lock ? opts.transaction?.LOCK.UPDATE : undefined,
    raw: true,
  });
  if (!board) throw notFound('The board');
  return board as BoardRecord;
}

/** What every page of one board shows around it: its status, revision, site and archive state. */
type BoardFrame = { status: BoardStatus; revision: number; siteId: string; archived: ArchiveState };

const archivedJson = (table: string, through: 'board' | 'site') =>
  `json_build_object('at', ${isoSql(`${table}.archived_at`)}, 'byName', COALESCE(${table}_by.name, 'A former member'),
     'through', '${through}')`;

/** The `ArchiveState` of boards row `b`: archived itself, else through its site (with `ARCHIVE_JOINS`). */
const ARCHIVED_JSON = `CASE WHEN b.archived_at IS NOT NULL THEN ${archivedJson('b', 'board')}
  WHEN s.archived_at IS NOT NULL THEN ${archivedJson('s', 'site')} END`;
const ARCHIVE_JOINS = `JOIN sites s ON s.id = b.site_id
  LEFT JOIN users b_by ON b_by.id = b.archived_by_id LEFT JOIN users s_by ON s_by.id = s.archived_by_id`;

/** A board's archive state, for its pages (the "archived" banner) and for refusals. */
export async function readArchiveState(boardId: string, transaction?: Transaction): Promise<ArchiveState> {
  const sql = `SELECT ${ARCHIVED_JSON} AS archived FROM boards b ${ARCHIVE_JOINS} WHERE b.id = $1`;
  const [row] = await select<{ archived: ArchiveState }>(sql, [boardId], transaction);
  return row?.archived ?? null;
}

/**
 * The frame of the caller's organisation's board (404 otherwise), in one statement: archived
 * through the board itself, else through its site. A board's layout and its page both ask for
 * it, so it is read once per request (React's `cache`, by actor and board id).
 */
export const readBoardFrame = cache(async (actor: Actor, boardId: string): Promise<BoardFrame> => {
  const rows = await select<BoardFrame>(
    `/* prepare:board_frame */ SELECT b.status, b.revision, b.site_id AS "siteId", ${ARCHIVED_JSON} AS archived
     FROM boards b ${ARCHIVE_JOINS} WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
  );
  if (!rows.length) throw notFound('The board');
  return rows[0];
});

/** A board's ways, design fields only, in rail order. */
export async function readWays(boardId: string, transaction?: Transaction): Promise<WayInput[]> {
  return (await readWayRows(boardId, transaction)).map(wayInputOf);
}

/** One event of the audit trail, of the board written. */
type BoardEvent = { action: AuditAction; details: Record<string, unknown> };

/**
 * One write of a board, in the caller's transaction with the row locked (`findBoard` with
 * `lock`): its columns (`set`), its ways (removed, inserted, updated: an inserted way whose id
 * exists anywhere fails the primary key `ways_pkey`; an updated one loses its label check)
 * and its audit events. The database raises the version. When the design changed (settings or
 * ways), the board is sized and the sizing stored with it; otherwise the stored sizing moves on
 * to the new version. Answers the board as written (deleted or not).
 */
export async function writeBoard(
  actor: Actor,
  board: BoardRecord,
  write: {
    set?: Partial<BoardRow>;
    ways?: { remove: string[]; insert: WayInput[]; update: WayInput[] };
    events: BoardEvent[];
  } & TreeWriteRequest,
  transaction: Transaction,
): Promise<BoardDto> {
  const boardId = board.id;
  const design = !!write.ways || Object.keys(write.set ?? {}).some((k) => ENGINE_SETTINGS.has(k));
  // The site's tree: locked, a new feed checked, feeding ways not taken away unasked (lib/dal/site-feed.ts)
  const tree =
    design || write.feed
      ? await beforeTreeWrite(
          actor,
          { id: boardId, siteId: board.siteId, name: write.set?.name ?? board.name, phases: board.phases },
          { ...write, phases: write.set?.phases },
          transaction,
        )
      : null;
  // Nothing to set (a new board's first write): no UPDATE, so a new board keeps version 1
  if (write.set && Object.keys(write.set).length)
    await Board.update(write.set, { where: { id: boardId }, transaction });
  const { remove = [], insert = [], update = [] } = write.ways ?? {};
  if (remove.length) await Way.destroy({ where: { boardId, id: remove }, transaction });
  if (update.length) {
    await db().query(
      `UPDATE ways SET rail = w.rail, position = w.position, device = w.device, circuit = w.circuit,
         label_status = 'unchecked', label_note = '', updated_at = now()
       FROM jsonb_to_recordset($2::jsonb) AS w(id uuid, rail int, position int, device jsonb, circuit jsonb)
       WHERE ways.id = w.id AND ways.board_id = $1`,
      { bind: [boardId, JSON.stringify(update.map(wayInputOf))], transaction },
    );
  }
  if (insert.length) {
    await Way.bulkCreate(
      insert.map((w) => ({ ...wayInputOf(w), boardId, labelStatus: 'unchecked', labelNote: '' })),
      { transaction },
    );
  }
  await auditMany(actor, write.events, { boardId, transaction });
  if (tree) {
    // The whole site re-sized with this board's change, every sizing stored
    const ripple = await afterTreeWrite(actor, { id: boardId, name: write.set?.name ?? board.name }, tree, transaction);
    if (write.out) write.out.ripple = ripple;
    return readBoard(actor, boardId, { transaction, deleted: true });
  }
  const written = await readBoard(actor, boardId, { transaction, deleted: true });
  if (design) {
    await storeSizing(written, transaction);
  } else {
    await db().query('UPDATE board_sizings SET version = $2 WHERE board_id = $1 AND version = $3', {
      bind: [boardId, written.version, board.version],
      transaction,
    });
  }
  return written;
}

/** The settings the engine reads: a write of any other column keeps the stored sizing. */
const ENGINE_SETTINGS = new Set([
  'supply',
  'phases',
  'enclosureModules',
  'incoming',
  'dwelling',
  'conditionalRatingKa',
]);

/**
 * The stored sizing of the board's current version (`s` joined to `b`), stored whole by this
 * engine with the review page's cut of it: a row left `pending` by a change upstream (migration
 * 0013), made by another revision of the engine (migration 0014) or stored without its cut of
 * this shape (migration 0015, `REVIEW_CUT`) is sized again and stored by its first read.
 */
const CURRENT_CUT = `(s.review->>'cut')::int IS NOT DISTINCT FROM ${REVIEW_CUT}`;
const CURRENT_SIZING = `s.board_id = b.id AND s.version = b.version AND NOT s.pending AND s.engine = ${ENGINE_REVISION}
  AND (${CURRENT_CUT} OR s.sizing IS NULL)`;

/** The SHA-256 of a sizing's JSON text, hex (stored beside it: `sizing_sha256`, migration 0013). */
export const sizingHash = (json: string | null): string | null =>
  json === null ? null : createHash('sha256').update(json).digest('hex');

/** A stored sizing: the engine's answer as JSON text (null when it refused), or its issues. */
type StoredSizing = { json: string | null; issues: FieldIssue[] };

/** Sizes the board as read and stores it for its version (an older stored sizing is replaced). */
async function storeSizing(board: BoardDto, transaction?: Transaction): Promise<StoredSizing> {
  // A board in a site's tree is sized with what is carried to it (lib/dal/site-tree.ts)
  const sized = sizeDesign(board.derivedSupply ? { ...board, supply: board.derivedSupply.supply } : board);
  const stored = { json: sized.sizing && JSON.stringify(sized.sizing), issues: sized.issues };
  const outcome = sized.sizing && JSON.stringify(sizingOutcome(sized.sizing));
  await db().query(
    `INSERT INTO board_sizings (board_id, version, sizing, sizing_sha256, pending, issues, outcome, review, engine)
     VALUES ($1, $2, $3::json, decode($4, 'hex'), false, $5::jsonb, $6::jsonb, $7::jsonb, ${ENGINE_REVISION})
     ON CONFLICT (board_id) DO UPDATE SET version = EXCLUDED.version, sizing = EXCLUDED.sizing,
       sizing_sha256 = EXCLUDED.sizing_sha256, pending = false, issues = EXCLUDED.issues, outcome = EXCLUDED.outcome,
       review = EXCLUDED.review, engine = EXCLUDED.engine
     WHERE board_sizings.version <= EXCLUDED.version`,
    {
      bind: [
        board.id,
        board.version,
        stored.json,
        sizingHash(stored.json),
        JSON.stringify(stored.issues),
        outcome,
        sized.sizing && JSON.stringify(reviewSizingOf(sized.sizing)),
      ],
      transaction,
    },
  );
  return stored;
}

/**
 * A board's row of a site re-size (lib/dal/site-tree.ts `resizeSite`), each JSON as text: its
 * sizing written whole, kept (the very text stored already: only what was carried and its outcome
 * are written), or left `pending` for its first read (the sizing not sent).
 */
export type TreeSizingRow = {
  board_id: string;
  version: number;
  write: 'whole' | 'keep' | 'pending';
  sizing: string | null;
  sha: string | null;
  issues: string;
  carried: string | null;
  outcome: string | null;
  review: string | null;
};

/** The statements that store a site re-size's rows at the site's tree version `treeVersion` (two at most). */
export function treeSizingStatements(rows: readonly TreeSizingRow[], treeVersion: number): Statement[] {
  const out: Statement[] = [];
  const written = rows.filter((r) => r.write !== 'keep');
  if (written.length) {
    // Each sizing its own bind parameter (sent as text, parsed once by PostgreSQL); a pending
    // one is not sent at all
    const bind: unknown[] = [treeVersion];
    const values = written.map((r) => {
      const whole = r.write === 'whole';
      const at = bind.push(
        r.board_id,
        r.version,
        whole ? r.sizing : null,
        r.sha,
        !whole,
        r.issues,
        r.carried,
        r.outcome,
        r.review,
      );
      return `($${at - 8}::uuid, $${at - 7}::int, $${at - 6}::json, decode($${at - 5}, 'hex'), $${at - 4}::boolean,
        $${at - 3}::jsonb, $${at - 2}::jsonb, $${at - 1}::jsonb, $${at}::jsonb, $1::int, ${ENGINE_REVISION})`;
    });
    out.push({
      sql: `INSERT INTO board_sizings (board_id, version, sizing, sizing_sha256, pending, issues, carried, outcome, review,
         tree_version, engine)
       VALUES ${values.join(', ')}
       ON CONFLICT (board_id) DO UPDATE SET version = EXCLUDED.version, sizing = EXCLUDED.sizing,
         sizing_sha256 = EXCLUDED.sizing_sha256, pending = EXCLUDED.pending, issues = EXCLUDED.issues,
         carried = EXCLUDED.carried, outcome = EXCLUDED.outcome, review = EXCLUDED.review, tree_version = EXCLUDED.tree_version,
         engine = EXCLUDED.engine`,
      bind,
    });
  }
  const kept = rows.filter((r) => r.write === 'keep');
  if (kept.length) {
    const bind: unknown[] = [treeVersion];
    const values = kept.map((r) => {
      const at = bind.push(r.board_id, r.version, r.issues, r.carried, r.outcome);
      return `($${at - 4}::uuid, $${at - 3}::int, $${at - 2}::jsonb, $${at - 1}::jsonb, $${at}::jsonb)`;
    });
    out.push({
      sql: `UPDATE board_sizings s SET version = v.version, issues = v.issues, carried = v.carried, outcome = v.outcome,
         tree_version = $1::int, engine = ${ENGINE_REVISION}
       FROM (VALUES ${values.join(', ')}) AS v(board_id, version, issues, carried, outcome)
       WHERE s.board_id = v.board_id`,
      bind,
    });
  }
  return out;
}

type SizingRow = { dto: string | null; current: boolean; json: string | null; issues: FieldIssue[] | null };

/**
 * The caller's organisation's board's sizing (404 otherwise), as stored for its current
 * version, with `withBoard` the board too: one statement. A board whose stored sizing is older
 * (written before migration 0008, left pending by a change upstream, or written behind the app's
 * back) is sized now and stored; a board of a site's tree, by re-sizing the whole site
 * (lib/dal/site-tree.ts).
 */
async function readCurrentSizing(
  actor: Actor,
  boardId: string,
  withBoard: boolean,
  again = false,
): Promise<{ board: BoardDto | null; stored: StoredSizing }> {
  const [row] = await select<SizingRow>(
    `/* prepare:${withBoard ? 'board_and_sizing' : 'stored_sizing'} */
     SELECT ${withBoard ? BOARD_DTO_JSON : 'NULL'} AS dto, s.board_id IS NOT NULL AS current, s.sizing::text AS json,
       s.issues
     FROM boards b LEFT JOIN board_sizings s ON ${CURRENT_SIZING}
     WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
  );
  if (!row) throw notFound('The board');
  const board = row.dto === null ? null : (JSON.parse(row.dto) as BoardDto);
  if (row.current) return { board, stored: { json: row.json, issues: row.issues ?? [] } };
  const stale = board ?? (await readBoard(actor, boardId));
  if (!again && (await resizeSiteOfStaleBoard(actor, stale))) return readCurrentSizing(actor, boardId, withBoard, true);
  return { board, stored: await storeSizing(stale) };
}

const parsedSizing = ({ json, issues }: StoredSizing): SizedBoard => ({
  sizing: json === null ? null : (JSON.parse(json) as BoardResult),
  issues,
});

/** The caller's organisation's board's stored sizing, as JSON text (see `readCurrentSizing`). */
export async function readStoredSizing(actor: Actor, boardId: string): Promise<StoredSizing> {
  return (await readCurrentSizing(actor, boardId, false)).stored;
}

/** The stored sizing of the caller's organisation's board, as the engine's result. */
export async function readSizedBoard(actor: Actor, boardId: string): Promise<SizedBoard> {
  return parsedSizing(await readStoredSizing(actor, boardId));
}

/** The caller's organisation's board and its stored sizing, in one statement: for pages that show both. */
export async function readBoardAndSizing(
  actor: Actor,
  boardId: string,
): Promise<{ board: BoardDto; sized: SizedBoard }> {
  const { board, stored } = await readCurrentSizing(actor, boardId, true);
  return { board: board!, sized: parsedSizing(stored) };
}

/** A new board of the caller's organisation with its first audit events: it starts at version 1. */
export async function insertBoard(
  actor: Actor,
  input: BoardCreateInput,
  events: BoardEvent[],
  transaction: Transaction,
): Promise<BoardDto> {
  const created = await Board.create(
    { ...input, organisationId: actor.organisationId, createdById: actor.userId, designChangedById: actor.userId },
    { transaction },
  );
  const ways = { remove: [], insert: [], update: [] };
  const record = created.get({ plain: true }) as BoardRecord;
  return writeBoard(actor, record, { ways, feed: input.feed, events }, transaction);
}

/**
 * The organisation's boards for the lists, optionally of one site: the live ones, or with
 * `archived` the archived ones (archived themselves or on an archived site), never deleted ones.
 */
export async function readBoardSummaries(
  actor: Actor,
  opts: { siteId?: string; archived?: boolean } = {},
): Promise<BoardSummary[]> {
  // Ways counted by way number, as the editor and the schedule count them (counts.ts)
  const rows = await select<Omit<BoardSummary, 'counts' | 'wayCount'> & { ways: CountedWay[] }>(
    `SELECT b.id, b.site_id AS "siteId", s.name AS "siteName", b.name, b.location, b.phases, b.status, b.revision,
       ${isoSql('b.updated_at')} AS "updatedAt", ${isoSql('COALESCE(b.archived_at, s.archived_at)')} AS "archivedAt",
       EXISTS (SELECT 1 FROM board_revisions r WHERE r.board_id = b.id) AS "everIssued",
       COALESCE((SELECT json_agg(json_build_object('id', w.id, 'rail', w.rail, 'position', w.position,
         'device', w.device, 'circuit', w.circuit IS NOT NULL) ORDER BY w.rail, w.position)
         FROM ways w WHERE w.board_id = b.id), '[]'::json) AS ways
     FROM boards b JOIN sites s ON s.id = b.site_id
     WHERE b.organisation_id = $1 AND b.deleted_at IS NULL AND ($2::uuid IS NULL OR b.site_id = $2)
       AND (COALESCE(b.archived_at, s.archived_at) IS NOT NULL) = $3
     ORDER BY b.updated_at DESC`,
    [actor.organisationId, opts.siteId ?? null, !!opts.archived],
  );
  return rows.map(({ ways, ...b }) => {
    const counts = countWays(b.phases, ways);
    return { ...b, wayCount: counts.ways, counts };
  });
}

/**
 * Counts of boards by site: of the organisation, or of one site; never deleted ones, and
 * archived ones only `withArchived`.
 */
export async function countBoardsBySite(
  where: { organisationId: string } | { siteId: string },
  withArchived: boolean,
): Promise<Map<string, number>> {
  const counts = (await Board.count({
    where: { ...where, deletedAt: null, ...(withArchived ? {} : { archivedAt: null }) },
    group: ['siteId'],
  })) as unknown as { siteId: string; count: number }[];
  return new Map(counts.map((c) => [c.siteId, Number(c.count)]));
}

/** A site's boards (with `live`, neither deleted nor archived), optionally locked for a change. */
export async function readSiteBoardRecords(
  siteId: string,
  opts: { transaction: Transaction; lock?: boolean; live?: boolean },
): Promise<BoardRecord[]> {
  const boards = await Board.findAll({
    where: { siteId, ...(opts.live ? { deletedAt: null, archivedAt: null } : {}) },
    transaction: opts.transaction,
    lock: opts.lock ? opts.transaction.LOCK.UPDATE : undefined,
  });
  return boards.map((b) => b.get({ plain: true }) as BoardRecord);
}

/**
 * Moves the version of every board of a site on (an editor still open cannot save into an
 * archived site); their stored sizings move on with them, since their design is unchanged.
 */
export async function raiseSiteBoardVersions(siteId: string, transaction: Transaction): Promise<void> {
  await db().query(
    `WITH raised AS (UPDATE boards SET version = version + 1 WHERE site_id = $1 RETURNING id, version)
     UPDATE board_sizings s SET version = r.version FROM raised r WHERE s.board_id = r.id AND s.version = r.version - 1`,
    { bind: [siteId], transaction },
  );
}

/** Whether the way is on the board. */
export async function wayOnBoard(boardId: string, wayId: string, transaction?: Transaction): Promise<boolean> {
  return (await Way.count({ where: { id: wayId, boardId }, transaction })) > 0;
}

/** A board's ways as stored, label checks included, in rail order (the walk). */
export async function readWayRows(boardId: string, transaction?: Transaction): Promise<WayRow[]> {
  const order: [string, string][] = [
    ['rail', 'ASC'],
    ['position', 'ASC'],
  ];
  return (await Way.findAll({ where: { boardId }, order, transaction, raw: true })) as unknown as WayRow[];
}

/** What the label walk recorded for each way of the board: id → status and note. */
export async function readLabelChecks(boardId: string): Promise<Map<string, { status: LabelStatus; note: string }>> {
  const sql = 'SELECT id, label_status AS status, label_note AS note FROM ways WHERE board_id = $1';
  const rows = await select<{ id: string; status: LabelStatus; note: string }>(sql, [boardId]);
  return new Map(rows.map(({ id, status, note }) => [id, { status, note }]));
}

/**
 * Records a label check on one way of the board (404 for a way not on it). A label check is
 * not a design write: the version stays. Answers every way's label status after it.
 */
export async function writeLabelCheck(
  boardId: string,
  wayId: string,
  check: Pick<WayRow, 'labelStatus' | 'labelNote' | 'labelCheckedById' | 'labelCheckedAt'>,
  transaction: Transaction,
): Promise<LabelStatus[]> {
  const [written] = await Way.update(check, { where: { id: wayId, boardId }, transaction });
  if (!written) throw notFound('The way');
  const ways = await Way.findAll({ where: { boardId }, attributes: ['labelStatus'], transaction });
  return ways.map((w) => w.labelStatus);
}

/** What issuing needs besides the board. */
export type IssueFacts = {
  orgName: string;
  allowSelfIssue: boolean;
  designChangedById: string | null;
  lastIssued: number;
  /** The board's comments, oldest first (as `commentsOf` answers them). */
  comments: CommentDto[];
};

/**
 * What the issue preview needs besides the board (the organisation's name and rule, who changed
 * the design last, the last revision issued) and the board's comments, in one statement.
 */
export async function readIssueFacts(actor: Actor, boardId: string): Promise<IssueFacts> {
  const [row] = await select<IssueFacts>(`SELECT ${ISSUE_FACTS} FROM organisations o WHERE o.id = $2`, [
    boardId,
    actor.organisationId,
  ]);
  return row ?? { orgName: '', allowSelfIssue: false, designChangedById: null, lastIssued: 0, comments: [] };
}

/** The columns of `IssueFacts` for board $1, from organisations row `o`. */
const ISSUE_FACTS = `o.name AS "orgName", o.allow_self_issue AS "allowSelfIssue",
  (SELECT b.design_changed_by_id FROM boards b WHERE b.id = $1) AS "designChangedById",
  COALESCE((SELECT max(r.revision) FROM board_revisions r WHERE r.board_id = $1), 0)::int AS "lastIssued",
  COALESCE((SELECT json_agg(json_build_object(
      'id', c.id, 'wayId', c.way_id, 'revision', c.revision, 'body', c.body,
      'authorName', COALESCE(u.name, 'A former member'), 'createdAt', ${isoSql('c.created_at')},
      'answeredAt', CASE WHEN c.answered_at IS NULL THEN NULL ELSE ${isoSql('c.answered_at')} END
    ) ORDER BY c.created_at, c.id)
    FROM comments c LEFT JOIN users u ON u.id = c.author_id WHERE c.board_id = $1), '[]'::json) AS comments`;

/**
 * The review page's read, in one statement: the caller's organisation's board (404 otherwise),
 * the cut of its stored sizing the page shows (`review`, migration 0015), the issue facts and
 * comments. Null when the stored sizing is not current (the caller reads it the long way, which
 * sizes it again).
 */
export async function readReviewSource(
  actor: Actor,
  boardId: string,
): Promise<{ board: BoardDto; sizing: ReviewSizing | null; issues: FieldIssue[]; facts: IssueFacts } | null> {
  const rows = await select<
    IssueFacts & { dto: string; current: boolean; cut: string | null; issues: FieldIssue[] | null }
  >(
    `/* prepare:review_source */
     SELECT ${BOARD_DTO_JSON} AS dto, s.board_id IS NOT NULL AS current, s.review::text AS cut, s.issues,
       ${ISSUE_FACTS}
     FROM boards b JOIN organisations o ON o.id = b.organisation_id
       LEFT JOIN board_sizings s ON ${CURRENT_SIZING}
     WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
  );
  if (!rows.length) throw notFound('The board');
  const [{ dto, current, cut, issues, ...facts }] = rows;
  if (!current) return null;
  return {
    board: JSON.parse(dto) as BoardDto,
    sizing: cut === null ? null : (JSON.parse(cut) as ReviewSizing),
    issues: issues ?? [],
    facts,
  };
}

/** One issued revision's print facts as `readIssuedPrintRows` reads them. */
type IssuedPrintRow = {
  status: BoardStatus;
  boardRevision: number;
  revision: number | null;
  issuedAt: Date | null;
  issuerName: string | null;
  name: string | null;
  labels: [string, LabelStatus, string][] | null;
};

/**
 * The row naming the issued revision a print request asks for (see `issuedPrintFacts`), with
 * the walk's label results for the board's current issued revision; no row for a board that
 * is not the caller's organisation's.
 */
export async function readIssuedPrintRows(
  actor: Actor,
  boardId: string,
  revision: number | null,
  mayPrintDraft: boolean,
): Promise<IssuedPrintRow[]> {
  return select<IssuedPrintRow>(
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
    [boardId, actor.organisationId, revision, mayPrintDraft],
  );
}

/** Whether any live board of the site is fed from a way (the site's boards form a tree). */
export async function siteHasSubMains(siteId: string, transaction?: Transaction): Promise<boolean> {
  const [row] = await select<{ tree: boolean }>(
    `SELECT EXISTS (SELECT 1 FROM boards WHERE site_id = $1 AND fed_from_way_id IS NOT NULL AND deleted_at IS NULL) AS tree`,
    [siteId],
    transaction,
  );
  return row.tree;
}

/** What was stored for board `b`, with `sizing` as its sizing. */
const storedJson = (sizing: string) => `(SELECT json_build_object('version', s.version, 'sizing', ${sizing},
    'carried', s.carried, 'outcome', s.outcome, 'sha', encode(s.sizing_sha256, 'hex'), 'pending', s.pending,
    'review', ${CURRENT_CUT})
  FROM board_sizings s WHERE s.board_id = b.id)`;
/** Whole (its sizing), or only its outcome (the sizing only for a row without one). */
const STORED_SIZING_JSON = storedJson('s.sizing');
const STORED_OUTCOME_JSON = storedJson('CASE WHEN s.outcome IS NULL THEN s.sizing END');

/**
 * The boards of each site as last read outside a transaction (committed states), frozen, each
 * under the key of its state: id, version, `stamped_in` and the board its feed's way is on. The
 * database raises a board's version and stamps it in every transaction that writes its row or a
 * way's place, device or circuit (migration 0008), so a key names one state of all a TreeBoard
 * holds but `stored`. A read sends the keys it holds, and PostgreSQL leaves out the JSON of every
 * board still at its key.
 */
type HeldBoards = Map<string, { key: string; board: TreeBoard }>;
const treeBoards = new LRUCache<string, { organisationId: string; boards: HeldBoards }>({ max: 200 });

/**
 * The site's boards as last read outside a transaction (`readTreeBoards`), without reading
 * them again: null when none are held or the site is not the organisation's. They may be out of
 * date; a caller compares their versions with the committed ones before it trusts them.
 */
export function heldTreeBoards(siteId: string, organisationId: string): TreeBoard[] | null {
  const held = treeBoards.get(siteId);
  if (!held?.boards.size || held.organisationId !== organisationId) return null;
  return [...held.boards.values()].map((h) => h.board);
}

/** Forgets the boards held for the site (the next `readTreeBoards` reads them whole). */
export function forgetTreeBoards(siteId: string): void {
  treeBoards.delete(siteId);
}
const TREE_BOARD_KEY = `b.id::text || ':' || b.version || ':' || COALESCE(b.stamped_in::text, '-') || ':' ||
  COALESCE((SELECT fw.board_id::text FROM ways fw WHERE fw.id = b.fed_from_way_id), '-')`;

/** The JSON text each board of `treeBoards` was parsed from. */
const textOf = new WeakMap<TreeBoard, string>();

/** The JSON text a board read without `stored` came from (`readTreeBoards`), or its JSON now. */
export const treeBoardText = (board: TreeBoard): string => textOf.get(board) ?? JSON.stringify(board);

/**
 * The site's boards (not deleted), oldest first, with their ways in rail order and feed, and what
 * was stored for each (`stored`: its whole sizing; `'outcome'`: only what a re-size compares, the
 * stored `outcome` (way verdicts and worst verdict), and the whole sizing only for a row that has none).
 * Without `stored` each board is the very (frozen) object of the last read while it is unchanged.
 */
export async function readTreeBoards(
  siteId: string,
  transaction?: Transaction,
  opts: { stored?: boolean | 'outcome'; only?: string; organisationId?: string } = {},
): Promise<TreeBoard[]> {
  const stored = opts.stored ?? true;
  const held: HeldBoards = new Map(treeBoards.get(siteId)?.boards);
  const known = new Map(held);
  const rows = await select<{ id: string; org: string; key: string; j: string | null; s: string | null }>(
    `SELECT b.id, b.organisation_id AS org, ${TREE_BOARD_KEY} AS key, CASE WHEN ${TREE_BOARD_KEY} = ANY($4::text[]) THEN NULL ELSE json_build_object(
       'id', b.id, ${SETTINGS_JSON}, 'archived', b.archived_at IS NOT NULL,
       'feed', ${FEED_JSON}, 'ways', ${waysJson()}, 'stored', NULL
     )::text END AS j,
     ${stored === 'outcome' ? STORED_OUTCOME_JSON : stored ? STORED_SIZING_JSON : 'NULL'}::text AS s
     FROM boards b
     WHERE b.site_id = $1 AND b.deleted_at IS NULL AND ($2::uuid IS NULL OR b.id = $2)
       AND ($3::uuid IS NULL OR b.organisation_id = $3)
     ORDER BY b.created_at, b.id`,
    [siteId, opts.only ?? null, opts.organisationId ?? null, [...known.values()].map((h) => h.key)],
    transaction,
  );
  const boards = rows.map((r) => {
    let board: TreeBoard;
    if (r.j === null) board = known.get(r.id)!.board;
    else {
      board = deepFreeze(JSON.parse(r.j) as TreeBoard);
      textOf.set(board, r.j);
    }
    // What a transaction reads may be its own uncommitted write: not kept
    if (r.j !== null && !transaction) held.set(r.id, { key: r.key, board });
    return stored ? { ...board, stored: r.s === null ? null : (JSON.parse(r.s) as TreeBoard['stored']) } : board;
  });
  if (!transaction && !opts.only && rows.length) {
    const live = new Set(rows.map((r) => r.id));
    for (const id of held.keys()) if (!live.has(id)) held.delete(id);
    treeBoards.set(siteId, { organisationId: rows[0].org, boards: held });
  }
  return boards;
}

/** A board of a site with its version and what was stored for it (`treeStoredStatement`). */
export type TreeStored = Pick<TreeBoard, 'id' | 'version' | 'stored'>;

/**
 * The site's boards (not deleted) in `readTreeBoards`' order, each with its version and what was
 * stored for it (its outcome): enough to tell whether boards read earlier are still the
 * committed ones (every write of a board or its ways raises its version, migration 0008). A
 * statement to send with others (lib/db.ts `inFewTrips`); its rows read by `treeStoredOf`.
 */
export function treeStoredStatement(siteId: string): Statement {
  return {
    sql: `SELECT json_build_object('id', b.id, 'version', b.version, 'stored', ${STORED_OUTCOME_JSON})::text AS j
     FROM boards b WHERE b.site_id = $1 AND b.deleted_at IS NULL
     ORDER BY b.created_at, b.id`,
    bind: [siteId],
  };
}

export const treeStoredOf = (rows: readonly Record<string, unknown>[]): TreeStored[] =>
  rows.map((r) => JSON.parse(r.j as string) as TreeStored);

/** Whether any live board of the site has no stored sizing current and whole (`CURRENT_SIZING`). */
export async function siteHasStaleSizing(siteId: string, transaction?: Transaction): Promise<boolean> {
  const [row] = await select<{ stale: boolean }>(
    `SELECT EXISTS (SELECT 1 FROM boards b LEFT JOIN board_sizings s ON ${CURRENT_SIZING}
       WHERE b.site_id = $1 AND b.deleted_at IS NULL AND s.board_id IS NULL) AS stale`,
    [siteId],
    transaction,
  );
  return row.stale;
}

/** Whether the caller's organisation's site is a tree: it has an origin or a board fed from a way. */
export async function siteIsTree(actor: Actor, siteId: string, transaction?: Transaction): Promise<boolean> {
  const [row] = await select<{ tree: boolean }>(
    `SELECT s.origin IS NOT NULL OR EXISTS (SELECT 1 FROM boards b
       WHERE b.site_id = s.id AND b.fed_from_way_id IS NOT NULL AND b.deleted_at IS NULL) AS tree
     FROM sites s WHERE s.id = $1 AND s.organisation_id = $2`,
    [siteId, actor.organisationId],
    transaction,
  );
  return !!row?.tree;
}

/** The site of the caller's organisation's board, or null. */
export async function readBoardSiteId(actor: Actor, boardId: string, transaction?: Transaction) {
  const sql = 'SELECT site_id FROM boards WHERE id = $1 AND organisation_id = $2';
  const [row] = await select<{ site_id: string }>(sql, [boardId, actor.organisationId], transaction);
  return row?.site_id ?? null;
}

/** The board a feeding way is on (the caller's organisation's), with its site; none when there is no such way. */
export async function readFeedingWayBoard(
  actor: Actor,
  boardId: string,
  wayId: string,
  transaction?: Transaction,
): Promise<{ site_id: string; board_name: string; deleted: boolean }[]> {
  return select(
    `SELECT b.site_id, b.name AS board_name, b.deleted_at IS NOT NULL AS deleted FROM ways w JOIN boards b ON b.id = w.board_id
     WHERE w.id = $1 AND b.id = $2 AND b.organisation_id = $3`,
    [wayId, boardId, actor.organisationId],
    transaction,
  );
}

/** Writes a board's feed: from this way, with its override and upstream RCD, or (null) from the origin. */
export async function writeBoardFeed(
  boardId: string,
  way: Extract<BoardFeed, { from: 'way' }> | null,
  transaction: Transaction,
): Promise<void> {
  await db().query(
    `UPDATE boards SET fed_from_way_id = $2, sub_main_design_current_a = $3, sub_main_design_current_reason = $4,
       upstream_rcd_time_delayed = $5 WHERE id = $1`,
    {
      bind: [
        boardId,
        way?.wayId ?? null,
        way?.designCurrentOverride?.amps ?? null,
        way?.designCurrentOverride?.reason ?? null,
        way?.upstreamRcdTimeDelayed ?? false,
      ],
      transaction,
    },
  );
}

/** What the tree stored for a board (the supply carried to it) and the sub-main currents of the boards its ways feed. */
export async function readDraftTreeRows(actor: Actor, boardId: string, transaction?: Transaction) {
  return select<{ carried: DerivedSupply | null; feeds: { wayId: string; amps: number | null }[] | null }>(
    `SELECT (SELECT s.carried FROM board_sizings s WHERE s.board_id = b.id) AS carried,
       (SELECT json_agg(json_build_object('wayId', d.fed_from_way_id,
          'amps', (SELECT (s.carried->'subMainCurrent'->>'value')::float8 FROM board_sizings s WHERE s.board_id = d.id)))
        FROM boards d JOIN ways w ON w.id = d.fed_from_way_id
        WHERE w.board_id = b.id AND d.deleted_at IS NULL) AS feeds
     FROM boards b WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
    transaction,
  );
}
