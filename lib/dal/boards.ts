import 'server-only';

import { isDeepStrictEqual } from 'node:util';

import { literal, Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { countWays, type CountedWay } from '@/lib/boards/counts';
import { boardRemoval, mayRestore } from '@/lib/boards/record-rules';
import { railOrder } from '@/lib/boards/layout';
import { settingsOf, type BoardCreateInput, type BoardSaveInput, type WayInput } from '@/lib/boards/schemas';
import type { BoardDto, BoardSummary, WayDto } from '@/lib/boards/types';
import { db, namedQuery } from '@/lib/db';
import { audit, type AuditAction } from '@/lib/dal/audit';
import { findSite } from '@/lib/dal/sites';
import { conflict, forbidden, HttpError, notFound } from '@/lib/errors';
import { Board, BoardRevision, Site, User, Way } from '@/models';

function wayDto(way: Way): WayDto {
  return {
    id: way.id,
    rail: way.rail,
    position: way.position,
    device: way.device as WayInput['device'],
    circuit: way.circuit as WayInput['circuit'],
    labelStatus: way.labelStatus,
    labelNote: way.labelNote,
  };
}

/** Plain data for the client from a board, its site name and its ways in rail order. */
export function boardDto(board: Board, siteName: string, ways: Way[]): BoardDto {
  return {
    id: board.id,
    siteId: board.siteId,
    siteName,
    ...settingsOf(board),
    status: board.status,
    version: board.version,
    revision: board.revision,
    updatedAt: board.updatedAt.toISOString(),
    ways: ways
      .slice()
      .sort((a, b) => a.rail - b.rail || a.position - b.position)
      .map(wayDto),
  };
}

/**
 * The organisation's boards, optionally of one site: the live ones, or with `archived` the
 * archived ones (archived themselves or on an archived site). Deleted boards never show.
 */
export async function listBoards(
  actor: Actor,
  opts: { siteId?: string; archived?: boolean } = {},
): Promise<BoardSummary[]> {
  db();
  if (opts.siteId) await findSite(actor, opts.siteId);
  const archived = opts.archived
    ? { [Op.or]: [{ archivedAt: { [Op.ne]: null } }, { '$site.archived_at$': { [Op.ne]: null } }] }
    : { archivedAt: null, '$site.archived_at$': null };
  const boards = await Board.findAll({
    where: {
      organisationId: actor.organisationId,
      deletedAt: null,
      ...archived,
      ...(opts.siteId ? { siteId: opts.siteId } : {}),
    },
    include: [{ model: Site, as: 'site', attributes: ['name', 'archivedAt'] }],
    order: [['updatedAt', 'DESC']],
  });
  // Ways counted by way number, as the editor and the schedule count them (counts.ts)
  const ways = await Way.findAll({
    where: { boardId: { [Op.in]: boards.map((b) => b.id) } },
    attributes: ['boardId', 'id', 'rail', 'position', 'device', [literal('circuit is not null'), 'circuit']],
    raw: true,
  });
  const byBoard = new Map<string, CountedWay[]>();
  for (const w of ways as unknown as (CountedWay & { boardId: string })[]) {
    const list = byBoard.get(w.boardId) ?? [];
    list.push(w);
    byBoard.set(w.boardId, list);
  }
  const issued = (await BoardRevision.count({
    where: { boardId: { [Op.in]: boards.map((b) => b.id) } },
    group: ['boardId'],
  })) as unknown as { boardId: string; count: number }[];
  const everIssuedIds = new Set(issued.map((c) => c.boardId));
  return boards.map((b) => {
    const counts = countWays(b.phases, byBoard.get(b.id) ?? []);
    return {
      id: b.id,
      siteId: b.siteId,
      siteName: (b as Board & { site?: Site }).site?.name ?? '',
      name: b.name,
      location: b.location,
      phases: b.phases,
      status: b.status,
      revision: b.revision,
      wayCount: counts.ways,
      counts,
      updatedAt: b.updatedAt.toISOString(),
      archivedAt: (b.archivedAt ?? (b as Board & { site?: Site }).site?.archivedAt)?.toISOString() ?? null,
      everIssued: everIssuedIds.has(b.id),
    };
  });
}

/**
 * The board row of the caller's organisation, or 404 (never another organisation's, nor a
 * deleted one unless `deleted` asks for it: undo needs it).
 */
export async function findBoard(
  actor: Actor,
  boardId: string,
  opts: { transaction?: Transaction; lock?: boolean; deleted?: boolean } = {},
): Promise<Board> {
  db();
  const board = await Board.findOne({
    where: { id: boardId, organisationId: actor.organisationId, ...(opts.deleted ? {} : { deletedAt: null }) },
    transaction: opts.transaction,
    lock: opts.lock ? opts.transaction?.LOCK.UPDATE : undefined,
  });
  if (!board) throw notFound('The board');
  return board;
}

/** When and by whom a board was archived (itself, or through its site); null when it is not. */
export type ArchiveState = { at: string; byName: string; through: 'board' | 'site' } | null;

/** A board's archive state, for its pages (the "archived" banner) and for refusals. */
export async function archiveStateOf(board: Board, transaction?: Transaction): Promise<ArchiveState> {
  let at = board.archivedAt;
  let by = board.archivedById;
  let through: 'board' | 'site' = 'board';
  if (!at) {
    const site = await Site.findByPk(board.siteId, { attributes: ['archivedAt', 'archivedById'], transaction });
    if (!site?.archivedAt) return null;
    [at, by, through] = [site.archivedAt, site.archivedById, 'site'];
  }
  const who = by ? await User.findByPk(by, { attributes: ['name'], transaction }) : null;
  return { at: at.toISOString(), byName: who?.name ?? 'A former member', through };
}

/** The archive state of one board of the caller's organisation (404 otherwise). */
export async function getArchiveState(actor: Actor, boardId: string): Promise<ArchiveState> {
  return archiveStateOf(await findBoard(actor, boardId));
}

/** 409 for any change to an archived board (or a board on an archived site): it is read-only. */
export async function assertNotArchived(board: Board, transaction?: Transaction): Promise<void> {
  const state = await archiveStateOf(board, transaction);
  if (state) {
    throw conflict(
      state.through === 'site'
        ? 'This board’s site is archived, so the board is read-only; an admin may restore the site.'
        : 'This board is archived, so it is read-only; an admin may restore it.',
      { archived: true },
    );
  }
}

/** The board, locked for a change, refusing an archived one (409). */
export async function findWritableBoard(actor: Actor, boardId: string, transaction: Transaction): Promise<Board> {
  const board = await findBoard(actor, boardId, { transaction, lock: true });
  await assertNotArchived(board, transaction);
  return board;
}

/** Whether the board has an issued revision (then it is kept for good). */
export async function everIssued(boardId: string, transaction?: Transaction): Promise<boolean> {
  return (await BoardRevision.count({ where: { boardId }, transaction })) > 0;
}

/** A timestamp column as the ISO text `Date.toISOString` gives (the DTO's form). */
const isoSql = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

/** What names one stored state of a board: its version and when it was last written. */
export type BoardStamp = { version: number; updatedAt: string };

/** That the board is the caller's organisation's, or 404: one small named statement. */
export async function requireBoard(actor: Actor, boardId: string): Promise<void> {
  const rows = await namedQuery('board-owned', 'select 1 from boards where id = $1 and organisation_id = $2 and deleted_at is null', [
    boardId,
    actor.organisationId,
  ]);
  if (!rows.length) throw notFound('The board');
}

/**
 * One board with its ways, in rail order, as the DTO itself: PostgreSQL builds the JSON, so
 * Node parses one string instead of building rows (the board read was most of the sizing
 * route's time). Keep the fields in step with `boardDto`; the integration tests compare the
 * two. `b` is the boards row.
 */
const BOARD_DTO_JSON = `json_build_object(
  'id', b.id, 'siteId', b.site_id, 'siteName', (SELECT s.name FROM sites s WHERE s.id = b.site_id),
  'name', b.name, 'location', b.location, 'phases', b.phases, 'supply', b.supply,
  'incoming', b.incoming, 'enclosureModules', b.enclosure_modules, 'rails', b.rails,
  'dwelling', b.dwelling, 'conditionalRatingKa', b.conditional_rating_ka, 'status', b.status, 'version', b.version, 'revision', b.revision,
  'updatedAt', ${isoSql('b.updated_at')},
  'ways', COALESCE((
    SELECT json_agg(json_build_object(
      'id', w.id, 'rail', w.rail, 'position', w.position, 'device', w.device,
      'circuit', w.circuit, 'labelStatus', w.label_status, 'labelNote', w.label_note
    ) ORDER BY w.rail, w.position)
    FROM ways w WHERE w.board_id = b.id
  ), '[]'::json)
)::text`;

/**
 * The board's stamp, and the board itself unless its stamp is still `known` ($3, $4): only
 * the boards row is touched when the stamp matches (the ways are read inside the CASE, which
 * PostgreSQL evaluates only when it must).
 */
const BOARD_UNLESS_SQL = `
SELECT b.version, ${isoSql('b.updated_at')} AS "updatedAt",
  CASE WHEN b.version = $3 AND ${isoSql('b.updated_at')} = $4 THEN NULL ELSE ${BOARD_DTO_JSON} END AS dto
FROM boards b WHERE b.id = $1 AND b.organisation_id = $2 AND b.deleted_at IS NULL`;

/**
 * The caller's organisation's board (404 otherwise), in one named statement: its stamp, and
 * the board DTO unless the stamp equals `known` (then `board` is null: what the caller kept
 * is still current).
 */
export async function getBoardUnless(
  actor: Actor,
  boardId: string,
  known: BoardStamp | null,
): Promise<{ stamp: BoardStamp; board: BoardDto | null }> {
  const rows = await namedQuery<BoardStamp & { dto: string | null }>('board-unless', BOARD_UNLESS_SQL, [
    boardId,
    actor.organisationId,
    known?.version ?? -1,
    known?.updatedAt ?? '',
  ]);
  if (!rows.length) throw notFound('The board');
  const { version, updatedAt, dto } = rows[0];
  return { stamp: { version, updatedAt }, board: dto === null ? null : (JSON.parse(dto) as BoardDto) };
}

/** The caller's organisation's board with its ways (404 otherwise). */
export async function getBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  return (await getBoardUnless(actor, boardId, null)).board!;
}

export async function createBoard(actor: Actor, input: BoardCreateInput): Promise<BoardDto> {
  const site = await findSite(actor, input.siteId);
  if (site.archivedAt) throw conflict('This site is archived; an admin may restore it before boards are added.');
  const board = await db().transaction(async (transaction) => {
    const created = await Board.create(
      { ...input, organisationId: actor.organisationId, createdById: actor.userId, designChangedById: actor.userId },
      { transaction },
    );
    await audit(actor, 'board.created', { name: input.name }, { boardId: created.id, transaction });
    return created;
  });
  return boardDto(board, site.name, []);
}

export async function renameBoard(
  actor: Actor,
  boardId: string,
  input: { name?: string; location?: string },
): Promise<BoardDto> {
  await db().transaction(async (transaction) => {
    const board = await findWritableBoard(actor, boardId, transaction);
    await board.update({ ...input, version: board.version + 1 }, { transaction });
    await audit(actor, 'board.renamed', input, { boardId, transaction });
  });
  return getBoard(actor, boardId);
}

/**
 * Removes a board (lib/boards/record-rules.ts boardRemoval): a board never issued is deleted
 * (hidden everywhere, its rows kept so that the delete can be undone); a board ever issued is
 * archived, by an admin only. The version moves on, so an editor still open cannot save it.
 */
export async function removeBoard(actor: Actor, boardId: string): Promise<{ effect: 'deleted' | 'archived' }> {
  return db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    const rule = boardRemoval(actor.role, {
      everIssued: await everIssued(boardId, transaction),
      archived: (await archiveStateOf(board, transaction)) !== null,
    });
    if (rule.refused) throw new HttpError(rule.status, rule.message);
    const now = new Date();
    if (rule.effect === 'delete') {
      await board.update({ deletedAt: now, deletedById: actor.userId, version: board.version + 1 }, { transaction });
      await audit(actor, 'board.deleted', { name: board.name }, { boardId, transaction });
      return { effect: 'deleted' as const };
    }
    await board.update({ archivedAt: now, archivedById: actor.userId, version: board.version + 1 }, { transaction });
    await audit(actor, 'board.archived', { name: board.name, revision: board.revision }, { boardId, transaction });
    return { effect: 'archived' as const };
  });
}

/** Archives a board (admins: records.archive), issued or not. */
export async function archiveBoard(actor: Actor, boardId: string): Promise<void> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('archive boards');
  await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    if (board.archivedAt) throw conflict('This board is archived already.');
    await board.update(
      { archivedAt: new Date(), archivedById: actor.userId, version: board.version + 1 },
      { transaction },
    );
    await audit(actor, 'board.archived', { name: board.name, revision: board.revision }, { boardId, transaction });
  });
}

/** Brings an archived board back into the lists (admins). */
export async function restoreBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('restore archived boards');
  await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    if (!board.archivedAt) throw conflict('This board is not archived.');
    await board.update({ archivedAt: null, archivedById: null, version: board.version + 1 }, { transaction });
    await audit(actor, 'board.restored', { name: board.name }, { boardId, transaction });
  });
  return getBoard(actor, boardId);
}

/** Undoes the delete of a draft board: it comes back as it was. */
export async function undeleteBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  if (!mayRestore(actor.role, 'deleted')) throw forbidden('restore deleted boards');
  await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true, deleted: true });
    if (!board.deletedAt) throw conflict('This board is not deleted.');
    await board.update({ deletedAt: null, deletedById: null, version: board.version + 1 }, { transaction });
    await audit(actor, 'board.undeleted', { name: board.name }, { boardId, transaction });
  });
  return getBoard(actor, boardId);
}

/** What changed between the stored ways and the saved ones, for the audit trail. */
export function diffWays(before: WayInput[], after: WayInput[]) {
  const old = new Map(before.map((w) => [w.id, w]));
  const now = new Map(after.map((w) => [w.id, w]));
  const added = after.filter((w) => !old.has(w.id)).map((w) => w.id);
  const removed = before.filter((w) => !now.has(w.id)).map((w) => w.id);
  const moved: string[] = [];
  const changed: string[] = [];
  for (const w of after) {
    const o = old.get(w.id);
    if (!o) continue;
    if (o.rail !== w.rail || o.position !== w.position) moved.push(w.id);
    // Compared by value: stored JSON comes back with its keys in PostgreSQL's order
    if (!isDeepStrictEqual(o.device, w.device) || !isDeepStrictEqual(o.circuit, w.circuit)) {
      changed.push(w.id);
    }
  }
  return { added, removed, moved, changed };
}

/**
 * Writes a save in one statement, and only if the board is still at the version and status the
 * caller's read found (the UPDATE of the board row takes its lock, so concurrent saves queue on
 * it and every one after the first finds a newer version and writes nothing). The ways are
 * removed, inserted (a new way's id that exists anywhere fails the primary key: no way of
 * another board is ever touched) and updated (a moved or changed way must have its label
 * checked again); a way left as it was is not written, so it keeps its label check, even one
 * recorded since the read. One statement is one transaction. Returns the new version, the
 * time and the labels as they stand, or no row when the board had changed.
 */
const SAVE_SQL = `
WITH b AS (
  UPDATE boards SET
    name = $4, location = $5, phases = $6, supply = $7::jsonb, incoming = $8::jsonb,
    enclosure_modules = $9, rails = $10, dwelling = $11, conditional_rating_ka = $18,
    status = CASE WHEN $12 THEN 'draft' ELSE status END,
    revision = revision + CASE WHEN $12 THEN 1 ELSE 0 END,
    version = version + 1, updated_at = now(), design_changed_by_id = $16
  WHERE id = $1 AND organisation_id = $2 AND version = $3 AND status = $13
    AND archived_at IS NULL AND deleted_at IS NULL
    AND NOT EXISTS (SELECT 1 FROM sites s WHERE s.id = boards.site_id AND s.archived_at IS NOT NULL)
  RETURNING version, revision, status,
    ${isoSql('updated_at')} AS updated_at
),
input AS (
  SELECT * FROM jsonb_to_recordset($14::jsonb)
    AS w(id uuid, rail int, position int, device jsonb, circuit jsonb, write text)
),
removed AS (
  DELETE FROM ways WHERE board_id = $1 AND id = ANY($15::uuid[]) AND EXISTS (SELECT 1 FROM b)
),
added AS (
  INSERT INTO ways (id, board_id, rail, position, device, circuit, label_status, label_note, created_at, updated_at)
  SELECT w.id, $1, w.rail, w.position, w.device, w.circuit, 'unchecked', '', now(), now()
  FROM input w WHERE w.write = 'insert' AND EXISTS (SELECT 1 FROM b)
),
updated AS (
  UPDATE ways SET rail = w.rail, position = w.position, device = w.device, circuit = w.circuit,
    label_status = 'unchecked', label_note = '', updated_at = now()
  FROM input w
  WHERE w.write = 'update' AND ways.id = w.id AND ways.board_id = $1 AND EXISTS (SELECT 1 FROM b)
),
audited AS (
  INSERT INTO audit_events (organisation_id, board_id, user_id, action, details, created_at)
  SELECT $2, $1, $16, e.action, e.details, now()
  FROM jsonb_to_recordset($17::jsonb) AS e(action text, details jsonb)
  WHERE EXISTS (SELECT 1 FROM b)
)
SELECT b.version, b.revision, b.status, b.updated_at AS "updatedAt",
  (SELECT COALESCE(json_object_agg(id, json_build_object('labelStatus', label_status, 'labelNote', label_note)), '{}')
     FROM ways WHERE board_id = $1) AS labels
FROM b`;

type SavedRow = {
  version: number;
  revision: number;
  status: BoardDto['status'];
  updatedAt: string;
  labels: Record<string, { labelStatus: WayDto['labelStatus']; labelNote: string }>;
};

/**
 * Saves the whole board at the version the editor opened, in two round trips: the board as
 * stored (one query), then one statement that writes it (SAVE_SQL). A stale save gets 409
 * with the current version, and nothing is written; saving an issued board (labels matched or not) starts
 * the next draft revision. The answer is built from what was written, without reading the
 * board again.
 */
export async function saveBoard(actor: Actor, boardId: string, input: BoardSaveInput): Promise<BoardDto> {
  const stored = await getBoard(actor, boardId);
  const refuse = (board: Pick<BoardDto, 'version' | 'status'>) => {
    if (board.version !== input.version) {
      throw conflict('Someone else saved this board after you opened it.', {
        currentVersion: board.version,
      });
    }
    if (board.status === 'in-review') {
      throw conflict('The board is in review; it can be changed once the inspector returns it.');
    }
  };
  try {
    refuse(stored);
  } catch (err) {
    // An archive also moves the version on: say that it is archived, not that someone saved
    await assertNotArchived(await findBoard(actor, boardId));
    throw err;
  }
  const diff = diffWays(stored.ways, input.ways);
  const added = new Set(diff.added);
  const touched = new Set([...diff.changed, ...diff.moved]);
  const startsRevision = stored.status === 'issued' || stored.status === 'labels-matched';
  const events = [
    ...diff.added.map((wayId) => ({ action: 'way.added' satisfies AuditAction, details: { wayId } })),
    ...diff.removed.map((wayId) => ({ action: 'way.removed' satisfies AuditAction, details: { wayId } })),
    ...diff.moved.map((wayId) => ({ action: 'way.moved' satisfies AuditAction, details: { wayId } })),
    ...diff.changed.map((wayId) => ({ action: 'way.changed' satisfies AuditAction, details: { wayId } })),
    {
      action: 'board.saved' satisfies AuditAction,
      details: { version: stored.version + 1, ...(startsRevision ? { newRevision: stored.revision + 1 } : {}) },
    },
  ];
  // Unchanged ways are not written at all; changed or moved ones lose their label check
  const writes = input.ways
    .map((way) => ({
      id: way.id,
      rail: way.rail,
      position: way.position,
      device: way.device,
      circuit: way.circuit,
      write: added.has(way.id) ? 'insert' : touched.has(way.id) ? 'update' : 'keep',
    }))
    .filter((w) => w.write !== 'keep');
  const { settings } = input;
  let rows: SavedRow[];
  try {
    rows = await namedQuery<SavedRow>('board-save', SAVE_SQL, [
      boardId,
      actor.organisationId,
      input.version,
      settings.name,
      settings.location,
      settings.phases,
      JSON.stringify(settings.supply),
      JSON.stringify(settings.incoming),
      settings.enclosureModules,
      settings.rails,
      settings.dwelling,
      startsRevision,
      stored.status,
      JSON.stringify(writes),
      diff.removed,
      actor.userId,
      JSON.stringify(events),
      settings.conditionalRatingKa ?? null,
    ]);
  } catch (err) {
    // A new way's id that some way already has (on this board or any other)
    if ((err as { constraint?: string }).constraint === 'ways_pkey') {
      throw conflict('A new way reuses the id of an existing way; reload the board.');
    }
    throw err;
  }
  if (!rows.length) {
    // The board changed, was archived or went between the read and the write: say why
    await assertNotArchived(await findBoard(actor, boardId));
    refuse(await getBoard(actor, boardId));
    throw conflict('Someone else changed this board after you opened it.');
  }
  const [saved] = rows;
  const written = new Set(writes.map((w) => w.id));
  return {
    ...stored,
    ...settingsOf(settings),
    status: saved.status,
    version: saved.version,
    revision: saved.revision,
    updatedAt: saved.updatedAt,
    ways: railOrder(input.ways).map((way) => ({
      id: way.id,
      rail: way.rail,
      position: way.position,
      device: way.device,
      circuit: way.circuit,
      labelStatus: (!written.has(way.id) && saved.labels[way.id]?.labelStatus) || 'unchecked',
      labelNote: (!written.has(way.id) && saved.labels[way.id]?.labelNote) || '',
    })),
  };
}
