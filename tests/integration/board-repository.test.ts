import crypto from 'node:crypto';

import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import { saveBodyOf } from '@/lib/api/save-body';
import type { Actor } from '@/lib/auth/session';
import { reviewPageData, reviewSizingOf, type ReviewSizing } from '@/lib/boards/review-page-data';
import { findBoard, readBoard, readBoardFrame, readStoredSizing } from '@/lib/dal/board-repository';
import { submitBoard } from '@/lib/dal/board-status';
import { createBoard, renameBoard } from '@/lib/dal/boards';
import { approveBoard } from '@/lib/dal/issue-and-return';
import { getReview, getReviewSource } from '@/lib/dal/review-page';
import { db } from '@/lib/db';
import { ENGINE_REVISION, type BoardResult } from '@/lib/sizing';
import { AuditEvent, Board, Comment, Site, Way } from '@/models';
import { demoWays, FLAT_BOARD } from '@/scripts/demo-data';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let actor: Actor;

beforeAll(async () => {
  team = await makeOrganisation('Repository');
  const { designer } = team.users;
  actor = {
    userId: designer.id,
    organisationId: team.org.id,
    role: 'designer',
    name: designer.name,
    email: designer.email,
  };
});

const stampOf = async (boardId: string) => {
  const row = (await Board.findByPk(boardId, { attributes: ['version', 'updatedAt'] }))!;
  return { version: row.version, updatedAt: row.updatedAt.getTime() };
};
const eventsOf = async (boardId: string) =>
  (await AuditEvent.findAll({ where: { boardId }, order: [['id', 'ASC']] })).map((e) => e.action);

describe('the board repository’s write', () => {
  it('writes the change and its audit rows together, and the version moves on by one', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const before = await readBoard(actor, board.id);
    const after = await renameBoard(actor, board.id, { name: 'Flat board, renamed' });
    expect(after.name).toBe('Flat board, renamed');
    expect(after.version).toBe(before.version + 1);
    const events = await AuditEvent.findAll({ where: { boardId: board.id, action: 'board.renamed' } });
    expect(events.map((e) => [e.userId, e.details])).toEqual([[actor.userId, { name: 'Flat board, renamed' }]]);
  });

  it('a save writes one audit row per way touched and one for the board, in the same transaction', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const opened = await readBoard(actor, board.id);
    const [first, second] = opened.ways.filter((w) => w.circuit);
    const ways = opened.ways
      .filter((w) => w.id !== first.id)
      .map((w) => (w.id === second.id ? { ...w, circuit: { ...w.circuit!, lengthM: w.circuit!.lengthM + 2 } } : w));
    const res = await boardRoute.PUT(jsonRequest('PUT', saveBodyOf({ ...opened, ways })), ctx({ boardId: board.id }));
    expect(res.status).toBe(200);
    expect(await eventsOf(board.id)).toEqual(['way.removed', 'way.changed', 'board.saved']);
    expect((await readBoard(actor, board.id)).version).toBe(opened.version + 1);

    // A save refused by the database (a new way reusing an existing way's id) writes no audit row either
    const other = await makeBoard(team.org.id, 'flat');
    const theirWay = (await Way.findOne({ where: { boardId: other.board.id } }))!;
    const now = await readBoard(actor, board.id);
    const stolen = { ...now.ways[0], id: theirWay.id, rail: 1, position: 0 };
    const refused = await boardRoute.PUT(
      jsonRequest('PUT', saveBodyOf({ ...now, rails: 2, ways: [...now.ways, stolen] })),
      ctx({ boardId: board.id }),
    );
    expect(refused.status).toBe(409);
    expect(await eventsOf(board.id)).toEqual(['way.removed', 'way.changed', 'board.saved']);
    expect((await readBoard(actor, board.id)).version).toBe(now.version);
  });
});

describe('the database raises a board’s version (migration 0008)', () => {
  it('on a direct UPDATE of the board row, once per transaction', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const before = await stampOf(board.id);
    await db().query('UPDATE boards SET location = $2 WHERE id = $1', { bind: [board.id, 'Under the stairs'] });
    const once = await stampOf(board.id);
    expect(once.version).toBe(before.version + 1);
    expect(once.updatedAt).toBeGreaterThan(before.updatedAt);
    await db().transaction(async (transaction) => {
      await db().query('UPDATE boards SET location = $2 WHERE id = $1', { bind: [board.id, 'Hall'], transaction });
      await db().query('UPDATE boards SET name = $2 WHERE id = $1', { bind: [board.id, 'Hall board'], transaction });
    });
    expect((await stampOf(board.id)).version).toBe(once.version + 1);
  });

  it('on a write of a way’s place, device or circuit, but not of its label check', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const way = (await Way.findOne({ where: { boardId: board.id, position: 1 } }))!;
    const v0 = (await stampOf(board.id)).version;
    await db().query(`UPDATE ways SET label_status = 'matches', label_note = 'ok' WHERE id = $1`, { bind: [way.id] });
    expect((await stampOf(board.id)).version).toBe(v0);
    await db().query('UPDATE ways SET position = 60 WHERE id = $1', { bind: [way.id] });
    expect((await stampOf(board.id)).version).toBe(v0 + 1);
    await db().query('DELETE FROM ways WHERE id = $1', { bind: [way.id] });
    expect((await stampOf(board.id)).version).toBe(v0 + 2);
    await db().query(
      `INSERT INTO ways (id, board_id, rail, position, device, circuit, label_status, label_note, created_at, updated_at)
       VALUES ($1, $2, 0, 61, $3::jsonb, null, 'unchecked', '', now(), now())`,
      { bind: [crypto.randomUUID(), board.id, JSON.stringify({ kind: 'blank', poles: 1, modules: 1 })] },
    );
    expect((await stampOf(board.id)).version).toBe(v0 + 3);
  });
});

describe('a board’s first version and its stored sizing through the lifecycle', () => {
  it('a new board starts at version 1, also with ways inserted in the transaction that made it (migration 0011)', async () => {
    const { site } = await makeBoard(team.org.id, 'flat');
    const created = await createBoard(actor, { ...FLAT_BOARD.settings, siteId: site.id });
    expect(created.version).toBe(1);
    expect((await stampOf(created.id)).version).toBe(1);
    expect(await eventsOf(created.id)).toEqual(['board.created']);

    const withWays = await db().transaction(async (transaction) => {
      const row = await Board.create(
        { ...FLAT_BOARD.settings, organisationId: team.org.id, siteId: site.id },
        { transaction },
      );
      await Way.bulkCreate(
        demoWays(FLAT_BOARD).map((w) => ({ ...w, boardId: row.id })),
        { transaction },
      );
      return row;
    });
    expect((await stampOf(withWays.id)).version).toBe(1);
    // The next transaction that writes it raises it once
    await renameBoard(actor, withWays.id, { name: 'Flat board, second state' });
    expect((await stampOf(withWays.id)).version).toBe(2);
  });

  it('submit and approve move the version on and the stored sizing with it: current at once, no sizing on the next read', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const storedRow = async () => {
      const [row] = await db().query<{ version: number; sizing: string; boardVersion: number }>(
        `SELECT s.version, s.sizing::text AS sizing, b.version AS "boardVersion"
         FROM board_sizings s JOIN boards b ON b.id = s.board_id WHERE s.board_id = $1`,
        { bind: [board.id], type: QueryTypes.SELECT },
      );
      return row;
    };
    await readStoredSizing(actor, board.id);
    const before = await storedRow();
    expect(before.version).toBe(before.boardVersion);

    await submitBoard(actor, board.id);
    const submitted = await storedRow();
    expect(submitted.boardVersion).toBe(before.boardVersion + 1);
    expect(submitted.version).toBe(submitted.boardVersion);
    expect(submitted.sizing).toBe(before.sizing);

    const { inspector } = team.users;
    const issuer: Actor = { ...actor, userId: inspector.id, role: 'inspector', name: inspector.name };
    await approveBoard(issuer, board.id, { declaration: inspector.name });
    const approved = await storedRow();
    expect((await readBoard(actor, board.id)).status).toBe('issued');
    expect(approved.boardVersion).toBe(submitted.boardVersion + 1);
    expect(approved.version).toBe(approved.boardVersion);
    expect(approved.sizing).toBe(before.sizing);
  });
});

describe('the board row (findBoard)', () => {
  it('is the model’s row as a plain object, every attribute with its type, archived or deleted alike', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    await Board.update(
      { conditionalRatingKa: 16, archivedAt: new Date(), archivedById: team.users.admin.id },
      { where: { id: board.id } },
    );
    const row = await findBoard(actor, board.id);
    expect(row).toEqual((await Board.findByPk(board.id))!.get({ plain: true }));
    expect(row.archivedAt).toBeInstanceOf(Date);
    expect(row.conditionalRatingKa).toBe(16);
    expect(row.supply).toMatchObject({ earthing: expect.any(String) });
    await Board.update({ deletedAt: new Date() }, { where: { id: board.id } });
    await expect(findBoard(actor, board.id)).rejects.toMatchObject({ status: 404 });
    expect((await findBoard(actor, board.id, { deleted: true })).deletedAt).toBeInstanceOf(Date);
  });
});

describe('the frame of a board’s pages (readBoardFrame)', () => {
  it('reads status, revision, site and archive state in one; archived through the board or its site, with who did it', async () => {
    const { site, board } = await makeBoard(team.org.id, 'flat');
    expect(await readBoardFrame(actor, board.id)).toEqual({
      status: 'draft',
      revision: board.revision,
      siteId: site.id,
      archived: null,
    });
    const { admin } = team.users;
    await Site.update(
      { archivedAt: new Date('2026-11-20T09:30:00.000Z'), archivedById: admin.id },
      { where: { id: site.id } },
    );
    expect((await readBoardFrame(actor, board.id)).archived).toEqual({
      at: '2026-11-20T09:30:00.000Z',
      byName: admin.name,
      through: 'site',
    });
    // The board's own archive comes first; a member no longer on record is named as such
    await Board.update(
      { archivedAt: new Date('2026-11-21T15:00:00.250Z'), archivedById: null },
      { where: { id: board.id } },
    );
    expect((await readBoardFrame(actor, board.id)).archived).toEqual({
      at: '2026-11-21T15:00:00.250Z',
      byName: 'A former member',
      through: 'board',
    });
  });

  it("answers 404 for another organisation's board and for a deleted one", async () => {
    const other = await makeOrganisation('Elsewhere');
    const { board } = await makeBoard(other.org.id, 'flat');
    await expect(readBoardFrame(actor, board.id)).rejects.toMatchObject({ status: 404 });
    const { board: mine } = await makeBoard(team.org.id, 'flat');
    await Board.update({ deletedAt: new Date() }, { where: { id: mine.id } });
    await expect(readBoardFrame(actor, mine.id)).rejects.toMatchObject({ status: 404 });
  });
});

describe('the review page’s read (getReviewSource)', () => {
  it('gives the page the same rows and summary as the whole stored sizing, with the comments and issue facts, in one read', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    await readStoredSizing(actor, board.id);
    await Comment.create({ boardId: board.id, wayId: null, authorId: actor.userId, revision: 1, body: 'Whole board' });
    const whole = await getReview(actor, board.id);
    const cut = await getReviewSource(actor, board.id);
    expect(whole.sizing).not.toBeNull();
    // The figures PostgreSQL takes out of the stored sizing are the engine's, to the last digit
    expect(reviewPageData(cut)).toEqual(reviewPageData({ ...whole, revisions: [] }));
    expect(JSON.stringify(cut.sizing).length).toBeLessThan(JSON.stringify(whole.sizing).length / 5);
    expect(cut.comments.map((c) => c.body)).toEqual(['Whole board']);
    expect(cut.issue).toEqual(whole.issue);
  });

  it("cuts the board's failing checks out as the whole sizing has them", async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    // Too small an enclosure for its ways, written behind the app's back (the version moves on)
    await Board.update({ enclosureModules: 12 }, { where: { id: board.id } });
    const whole = await getReview(actor, board.id);
    const cut = await getReviewSource(actor, board.id);
    const failing = whole.sizing!.summary.checks.filter((c) => !c.ok).map((c) => c.message);
    expect(failing).toEqual([expect.stringMatching(/^\d+ of 12 modules used\.$/)]);
    expect(reviewPageData(cut).summary!.failing).toEqual(failing);
    expect(reviewPageData(cut)).toEqual(reviewPageData({ ...whole, revisions: [] }));
  });

  it('reads the cut stored with the sizing (migration 0015); a row stored without one is sized again by its read', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    await Board.update({ enclosureModules: 12 }, { where: { id: board.id } });
    await readStoredSizing(actor, board.id);
    const rowOf = async () => {
      const [row] = await db().query<{ review: ReviewSizing | null; sizing: BoardResult }>(
        'SELECT review, sizing FROM board_sizings WHERE board_id = $1',
        { bind: [board.id], type: QueryTypes.SELECT },
      );
      return row;
    };
    const { review, sizing } = await rowOf();
    expect(review).toEqual(reviewSizingOf(sizing));
    expect(review!.summary.checks.map((c) => c.ok)).toEqual([false]);
    const stored = await getReviewSource(actor, board.id);
    const setReview = (value: ReviewSizing | null) =>
      db().query('UPDATE board_sizings SET review = $2::jsonb WHERE board_id = $1', {
        bind: [board.id, value && JSON.stringify(value)],
      });
    await setReview(null);
    // Not current without its cut: this read sizes the board the long way and stores both
    expect(reviewPageData(await getReviewSource(actor, board.id))).toEqual(reviewPageData(stored));
    expect((await rowOf()).review).toEqual(review);
    expect(await getReviewSource(actor, board.id)).toEqual(stored);
    // A cut of an older shape (without each way's volt drop limit: before REVIEW_CUT 2) is not
    // current either
    const { cut: _cut, ...older } = review!;
    const noLimits = older.ways.map((w) => ({ ...w, result: w.result && { ...w.result, vdLimitPct: undefined } }));
    await setReview({ ...older, ways: noLimits } as ReviewSizing);
    expect(reviewPageData(await getReviewSource(actor, board.id))).toEqual(reviewPageData(stored));
    expect((await rowOf()).review).toEqual(review);
    // The page shows the stored cut, not one made again from the whole sizing
    await setReview({ ...review!, summary: { ...review!.summary, maxDemandA: 12345 } });
    expect((await getReviewSource(actor, board.id)).sizing!.summary.maxDemandA).toBe(12345);
  });

  it('sizes a board whose stored sizing is older than the board, stores it, and answers as the long way does', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    await readStoredSizing(actor, board.id);
    // A write behind the app's back raises the version (migration 0008), so the stored sizing is stale
    await Board.update({ location: 'Under the stairs' }, { where: { id: board.id } });
    const { version } = await stampOf(board.id);
    const cut = await getReviewSource(actor, board.id);
    expect(cut.board.location).toBe('Under the stairs');
    expect(cut.sizing).not.toBeNull();
    const [stored] = await db().query<{ version: number }>('SELECT version FROM board_sizings WHERE board_id = $1', {
      bind: [board.id],
      type: QueryTypes.SELECT,
    });
    expect(stored.version).toBe(version);
    expect(reviewPageData(await getReviewSource(actor, board.id))).toEqual(reviewPageData(cut));
  });

  it("answers 404 for another organisation's board", async () => {
    const other = await makeOrganisation('Elsewhere');
    const { board } = await makeBoard(other.org.id, 'flat');
    await expect(getReviewSource(actor, board.id)).rejects.toMatchObject({ status: 404 });
  });
});

describe('stored sizings carry the engine revision that made them (migration 0014)', () => {
  it('an answer of another engine revision is not served: the first read sizes the board afresh and stores it', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    const fresh = await readStoredSizing(actor, board.id);
    expect(fresh.json).not.toBeNull();
    const row = async () =>
      (
        await db().query<{ engine: number | null; pending: boolean; sha: string; json: string }>(
          `SELECT engine, pending, encode(sizing_sha256, 'hex') AS sha, sizing::text AS json
           FROM board_sizings WHERE board_id = $1`,
          { bind: [board.id], type: QueryTypes.SELECT },
        )
      )[0];
    expect((await row()).engine).toBe(ENGINE_REVISION);
    // What an older engine stored for the same version of the board (and a row from before the stamp)
    const older = JSON.stringify({ ...JSON.parse(fresh.json!), ways: [] });
    for (const engine of [ENGINE_REVISION - 1, null]) {
      await db().query('UPDATE board_sizings SET sizing = $2::json, engine = $3 WHERE board_id = $1', {
        bind: [board.id, older, engine],
      });
      expect((await readStoredSizing(actor, board.id)).json).toBe(fresh.json);
      const stored = await row();
      expect(stored).toEqual({
        engine: ENGINE_REVISION,
        pending: false,
        json: fresh.json,
        sha: crypto.createHash('sha256').update(fresh.json!).digest('hex'),
      });
    }
    // The same answer of this revision is served as stored (no sizing again)
    await db().query('UPDATE board_sizings SET sizing = $2::json WHERE board_id = $1', { bind: [board.id, older] });
    expect((await readStoredSizing(actor, board.id)).json).toBe(older);
  });
});
