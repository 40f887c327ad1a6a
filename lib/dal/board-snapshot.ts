import 'server-only';

import type { Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import { settingsOf, wayInputOf } from '@/lib/boards/schemas';
import { env } from '@/lib/env';
import { readWays, type BoardRecord } from '@/lib/dal/board-repository';
import { draftTreeContext } from '@/lib/dal/site-supply';
import { withTreeContext } from '@/lib/sites/tree-context';
import { fedFromWords } from '@/lib/names';
import { Organisation, Site } from '@/models';

/**
 * The live board as a snapshot (what would be frozen if it were issued now). A board of a supply
 * tree is frozen as the tree sizes it (lib/dal/site-supply.ts draftTreeContext): with the supply
 * carried down to it, and each of its sub-mains with the design current of the board it feeds.
 */
export async function liveSnapshot(
  actor: Actor,
  board: BoardRecord,
  transaction?: Transaction,
): Promise<BoardSnapshot> {
  // One after another: inside a transaction they share one connection, and pg refuses
  // (from pg 9) a query sent while another is running on it
  const site = await Site.findByPk(board.siteId, { attributes: ['name'], transaction });
  const ways = await readWays(board.id, transaction);
  const org = await Organisation.findByPk(actor.organisationId, { attributes: ['name'], transaction });
  const tree = await draftTreeContext(actor, board.id, transaction);
  const design = withTreeContext({ settings: settingsOf(board), ways }, tree);
  return {
    settings: design.settings,
    siteName: site?.name ?? '',
    organisationName: org?.name ?? '',
    ways: design.ways.map(wayInputOf),
    ...(tree.fedFrom ? { fedFrom: fedFromWords(tree.fedFrom) } : {}),
  };
}

export function boardUrl(boardId: string): string {
  return new URL(`/boards/${boardId}`, env().APP_URL).href;
}
