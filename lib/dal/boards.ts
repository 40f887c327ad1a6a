import 'server-only';

import { Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { settingsOf, type BoardCreateInput, type BoardSaveInput, type WayInput } from '@/lib/boards/schemas';
import type { BoardDto, BoardSummary, WayDto } from '@/lib/boards/types';
import { db } from '@/lib/db';
import { audit, auditMany } from '@/lib/dal/audit';
import { findSite } from '@/lib/dal/sites';
import { conflict, notFound } from '@/lib/errors';
import { Board, Site, Way } from '@/models';

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

/** The organisation's boards, optionally of one site. */
export async function listBoards(actor: Actor, opts: { siteId?: string } = {}): Promise<BoardSummary[]> {
  db();
  if (opts.siteId) await findSite(actor, opts.siteId);
  const boards = await Board.findAll({
    where: {
      organisationId: actor.organisationId,
      ...(opts.siteId ? { siteId: opts.siteId } : {}),
    },
    include: [{ model: Site, as: 'site', attributes: ['name'] }],
    order: [['updatedAt', 'DESC']],
  });
  const counts = (await Way.count({
    where: { boardId: { [Op.in]: boards.map((b) => b.id) } },
    group: ['boardId'],
  })) as unknown as { boardId: string; count: number }[];
  const byBoard = new Map(counts.map((c) => [c.boardId, Number(c.count)]));
  return boards.map((b) => ({
    id: b.id,
    siteId: b.siteId,
    siteName: (b as Board & { site?: Site }).site?.name ?? '',
    name: b.name,
    location: b.location,
    phases: b.phases,
    status: b.status,
    revision: b.revision,
    wayCount: byBoard.get(b.id) ?? 0,
    updatedAt: b.updatedAt.toISOString(),
  }));
}

/** The board row of the caller's organisation, or 404 (never another organisation's). */
export async function findBoard(
  actor: Actor,
  boardId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<Board> {
  db();
  const board = await Board.findOne({
    where: { id: boardId, organisationId: actor.organisationId },
    transaction: opts.transaction,
    lock: opts.lock ? opts.transaction?.LOCK.UPDATE : undefined,
  });
  if (!board) throw notFound('The board');
  return board;
}

/**
 * One board with its ways: two plain queries side by side. Building model instances for
 * every way cost more than the queries themselves.
 */
export async function getBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  db();
  const [board, ways] = await Promise.all([
    Board.findOne({
      where: { id: boardId, organisationId: actor.organisationId },
      include: [{ model: Site, as: 'site', attributes: ['name'] }],
      raw: true,
      nest: true,
    }) as unknown as Promise<(Board & { site?: { name: string } }) | null>,
    Way.findAll({ where: { boardId }, raw: true }) as unknown as Promise<Way[]>,
  ]);
  // The ways were read without the organisation filter: they count only if the board is ours.
  if (!board) throw notFound('The board');
  return boardDto(board, board.site?.name ?? '', ways);
}

export async function createBoard(actor: Actor, input: BoardCreateInput): Promise<BoardDto> {
  const site = await findSite(actor, input.siteId);
  const board = await db().transaction(async (transaction) => {
    const created = await Board.create(
      { ...input, organisationId: actor.organisationId, createdById: actor.userId },
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
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    await board.update({ ...input, version: board.version + 1 }, { transaction });
    await audit(actor, 'board.renamed', input, { boardId, transaction });
  });
  return getBoard(actor, boardId);
}

export async function deleteBoard(actor: Actor, boardId: string): Promise<void> {
  await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    await audit(actor, 'board.deleted', { name: board.name }, { boardId, transaction });
    await board.destroy({ transaction });
  });
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
    if (
      JSON.stringify(o.device) !== JSON.stringify(w.device) ||
      JSON.stringify(o.circuit) !== JSON.stringify(w.circuit)
    ) {
      changed.push(w.id);
    }
  }
  return { added, removed, moved, changed };
}

/**
 * Saves a whole board in one transaction. The row is locked and the caller's version
 * must be the stored one: a stale save gets 409 with the stored board, and nothing is
 * written. Saving an issued or verified board starts the next draft revision.
 */
export async function saveBoard(actor: Actor, boardId: string, input: BoardSaveInput): Promise<BoardDto> {
  const sequelize = db();
  await sequelize.transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    if (board.version !== input.version) {
      throw conflict('Someone else saved this board after you opened it.', {
        currentVersion: board.version,
      });
    }
    if (board.status === 'in-review') {
      throw conflict('The board is in review; it can be changed once the inspector returns it.');
    }
    const stored = await Way.findAll({ where: { boardId }, transaction });
    const diff = diffWays(stored.map(wayDto), input.ways);
    // A new way's id must be new: an upsert must never reach a way of another board.
    if (diff.added.length) {
      const taken = await Way.count({ where: { id: { [Op.in]: diff.added } }, transaction });
      if (taken) throw conflict('A new way reuses the id of an existing way; reload the board.');
    }
    const startsRevision = board.status === 'issued' || board.status === 'verified';
    await board.update(
      {
        ...input.settings,
        version: board.version + 1,
        ...(startsRevision ? { status: 'draft', revision: board.revision + 1 } : {}),
      },
      { transaction },
    );
    // Ways are replaced in place: removed ones go, the rest are written with their new places
    // (places are unique per board, checked at commit, so the order of writing does not matter).
    if (diff.removed.length) {
      await Way.destroy({ where: { boardId, id: { [Op.in]: diff.removed } }, transaction });
    }
    // One upsert writes every way; a moved or changed way needs its label checked again.
    const previous = new Map(stored.map((w) => [w.id, w]));
    const touched = new Set([...diff.changed, ...diff.moved]);
    await Way.bulkCreate(
      input.ways.map((way) => {
        const existing = previous.get(way.id);
        const keepLabel = existing && !touched.has(way.id);
        return {
          id: way.id,
          boardId,
          rail: way.rail,
          position: way.position,
          device: way.device,
          circuit: way.circuit,
          labelStatus: keepLabel ? existing.labelStatus : 'unchecked',
          labelNote: keepLabel ? existing.labelNote : '',
        };
      }),
      {
        transaction,
        updateOnDuplicate: ['rail', 'position', 'device', 'circuit', 'labelStatus', 'labelNote', 'updatedAt'],
      },
    );
    await auditMany(
      actor,
      [
        ...diff.added.map((wayId) => ({ action: 'way.added' as const, details: { wayId } })),
        ...diff.removed.map((wayId) => ({ action: 'way.removed' as const, details: { wayId } })),
        ...diff.moved.map((wayId) => ({ action: 'way.moved' as const, details: { wayId } })),
        ...diff.changed.map((wayId) => ({ action: 'way.changed' as const, details: { wayId } })),
        {
          action: 'board.saved' as const,
          details: { version: board.version, ...(startsRevision ? { newRevision: board.revision } : {}) },
        },
      ],
      { boardId, transaction },
    );
  });
  return getBoard(actor, boardId);
}
