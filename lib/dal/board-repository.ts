import 'server-only';

import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import {
  engineInputOf,
  wayInputOf,
  type BoardDto,
  type BoardRow,
  type BoardSettings,
  type WayInput,
} from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import { auditMany, type AuditAction } from '@/lib/dal/audit';
import { afterTreeWrite, beforeTreeWrite, type TreeWriteRequest } from '@/lib/dal/site-feed';
import { notFound, type FieldIssue } from '@/lib/errors';
import { parseBoardInput, sizeBoard, SizingInputError, type BoardResult } from '@/lib/sizing';
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

/** The board DTO of boards row `b`, its site's name and its ways in rail order, as JSON text. */
const BOARD_DTO_JSON = `json_build_object(
  'id', b.id, 'siteId', b.site_id, 'siteName', (SELECT s.name FROM sites s WHERE s.id = b.site_id),
  'name', b.name, 'location', b.location, 'phases', b.phases, 'supply', b.supply,
  'incoming', b.incoming, 'enclosureModules', b.enclosure_modules, 'rails', b.rails,
  'dwelling', b.dwelling, 'conditionalRatingKa', b.conditional_rating_ka, 'status', b.status,
  'version', b.version, 'revision', b.revision, 'updatedAt', ${isoSql('b.updated_at')},
  'ways', COALESCE((
    SELECT json_agg(json_build_object(
      'id', w.id, 'rail', w.rail, 'position', w.position, 'device', w.device,
      'circuit', w.circuit, 'labelStatus', w.label_status, 'labelNote', w.label_note
    ) ORDER BY w.rail, w.position)
    FROM ways w WHERE w.board_id = b.id
  ), '[]'::json),
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

/**
 * The board row of the caller's organisation, or 404 (never another organisation's, nor a
 * deleted one unless `deleted` asks for it: undo needs it); `lock` locks it for a change.
 */
export async function findBoard(
  actor: Actor,
  boardId: string,
  opts: ReadOptions & { lock?: boolean } = {},
): Promise<Board> {
  const board = await Board.findOne({
    where: { id: boardId, organisationId: actor.organisationId, ...(opts.deleted ? {} : { deletedAt: null }) },
    transaction: opts.transaction,
    lock: opts.lock ? opts.transaction?.LOCK.UPDATE : undefined,
  });
  if (!board) throw notFound('The board');
  return board;
}

/** That the board is the caller's organisation's, or 404. */
export async function requireBoard(actor: Actor, boardId: string): Promise<void> {
  const rows = await select('SELECT 1 FROM boards WHERE id = $1 AND organisation_id = $2 AND deleted_at IS NULL', [
    boardId,
    actor.organisationId,
  ]);
  if (!rows.length) throw notFound('The board');
}

/** A board's ways, design fields only, in rail order. */
export async function readWays(boardId: string, transaction?: Transaction): Promise<WayInput[]> {
  const rows = await Way.findAll({
    where: { boardId },
    attributes: ['id', 'rail', 'position', 'device', 'circuit'],
    order: [
      ['rail', 'ASC'],
      ['position', 'ASC'],
    ],
    transaction,
  });
  return rows.map(wayInputOf);
}

/** One event of the audit trail, of the board written. */
export type BoardEvent = { action: AuditAction; details: Record<string, unknown> };

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
  board: Board,
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
          {
            ways: write.ways,
            phases: write.set?.phases,
            feed: write.feed,
            confirmFeedChanges: write.confirmFeedChanges,
          },
          transaction,
        )
      : null;
  await Board.update({ ...write.set }, { where: { id: boardId }, transaction });
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

/** A board sized, or the reasons the engine refused it (then `sizing` is null). */
export type SizedBoard = { sizing: BoardResult | null; issues: FieldIssue[] };

/** Sizes a board's settings and ways; a board the engine refuses gets its issues instead. */
export function sizeDesign(board: BoardSettings & { ways: readonly WayInput[] }): SizedBoard {
  // Parsed once, and marked so that the engine does not parse it again
  try {
    return { sizing: sizeBoard(parseBoardInput(engineInputOf(board, board.ways))), issues: [] };
  } catch (err) {
    if (!(err instanceof SizingInputError)) throw err;
    return { sizing: null, issues: err.issues.map(({ path, message }) => ({ path: path || '(body)', message })) };
  }
}

/** A stored sizing: the engine's answer as JSON text (null when it refused), or its issues. */
export type StoredSizing = { json: string | null; issues: FieldIssue[] };

/** Sizes the board as read and stores it for its version (an older stored sizing is replaced). */
async function storeSizing(board: BoardDto, transaction?: Transaction): Promise<StoredSizing> {
  // A board in a site's tree is sized with what is carried to it (lib/dal/site-tree.ts)
  const sized = sizeDesign(board.derivedSupply ? { ...board, supply: board.derivedSupply.supply } : board);
  const stored = { json: sized.sizing && JSON.stringify(sized.sizing), issues: sized.issues };
  await db().query(
    `INSERT INTO board_sizings (board_id, version, sizing, issues) VALUES ($1, $2, $3::json, $4::jsonb)
     ON CONFLICT (board_id) DO UPDATE SET version = EXCLUDED.version, sizing = EXCLUDED.sizing, issues = EXCLUDED.issues
     WHERE board_sizings.version <= EXCLUDED.version`,
    { bind: [board.id, board.version, stored.json, JSON.stringify(stored.issues)], transaction },
  );
  return stored;
}

/**
 * The caller's organisation's board's sizing (404 otherwise), as stored for its current
 * version: one statement. A board whose stored sizing is older (written before migration 0008,
 * or behind the app's back) is sized now and stored.
 */
export async function readStoredSizing(actor: Actor, boardId: string): Promise<StoredSizing> {
  const rows = await select<{ current: boolean; json: string | null; issues: FieldIssue[] | null }>(
    `SELECT s.board_id IS NOT NULL AS current, s.sizing::text AS json, s.issues FROM boards b
     LEFT JOIN board_sizings s ON s.board_id = b.id AND s.version = b.version
     WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
  );
  if (!rows.length) throw notFound('The board');
  const [row] = rows;
  if (row.current) return { json: row.json, issues: row.issues ?? [] };
  return storeSizing(await readBoard(actor, boardId));
}

/**
 * The caller's organisation's board (404 otherwise) and its stored sizing, in one statement:
 * for pages that show both. A stored sizing older than the board is sized now and stored.
 */
export async function readBoardAndSizing(
  actor: Actor,
  boardId: string,
): Promise<{ board: BoardDto; sized: SizedBoard }> {
  const rows = await select<{ dto: string; current: boolean; json: string | null; issues: FieldIssue[] | null }>(
    `SELECT ${BOARD_DTO_JSON} AS dto, s.board_id IS NOT NULL AS current, s.sizing::text AS json, s.issues
     FROM boards b LEFT JOIN board_sizings s ON s.board_id = b.id AND s.version = b.version
     WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`,
    [boardId, actor.organisationId],
  );
  if (!rows.length) throw notFound('The board');
  const [row] = rows;
  const board = JSON.parse(row.dto) as BoardDto;
  const { json, issues } = row.current ? { json: row.json, issues: row.issues ?? [] } : await storeSizing(board);
  return { board, sized: { sizing: json === null ? null : (JSON.parse(json) as BoardResult), issues } };
}

/** The stored sizing of the caller's organisation's board, as the engine's result. */
export async function readSizedBoard(actor: Actor, boardId: string): Promise<SizedBoard> {
  const { json, issues } = await readStoredSizing(actor, boardId);
  return { sizing: json === null ? null : (JSON.parse(json) as BoardResult), issues };
}
