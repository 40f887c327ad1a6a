import crypto from 'node:crypto';

import type { BoardSettings, WayInput } from '@/lib/boards/schemas';
import type { SiteTreeInput } from '@/lib/supply';
import { Board, Site, Way } from '@/models';

/**
 * A site tree of lib/supply's unit fixtures (tests/unit/supply/fixtures.ts, hand-worked there)
 * stored as boards and ways of one site of an organisation, with the feeds left "from the
 * origin" (the tests link them through the routes). Ids are fresh; `ids` maps the fixture's.
 */
export async function storeTree(organisationId: string, tree: SiteTreeInput, opts: { siteName?: string } = {}) {
  const site = await Site.create({ organisationId, name: opts.siteName ?? `Tree ${crypto.randomUUID().slice(0, 6)}` });
  const ids = new Map<string, string>();
  const boards = new Map<string, Board>();
  for (const b of tree.boards) {
    ids.set(b.id, crypto.randomUUID());
    for (const w of b.board.ways) ids.set(w.id, crypto.randomUUID());
  }
  for (const b of tree.boards) {
    const settings: BoardSettings = {
      name: b.name,
      location: '',
      phases: b.board.phases,
      // Typed values unlike the origin's: a board fed from a way must not be sized with them
      supply: { earthing: 'TT', uoV: 230, zeOhm: 21, pfcKa: 0.5, source: 'public' },
      incoming: b.board.incoming as BoardSettings['incoming'],
      enclosureModules: b.board.enclosureModules,
      rails: 1,
      dwelling: b.board.dwelling ?? false,
    };
    const row = await Board.create({ ...settings, id: ids.get(b.id), organisationId, siteId: site.id });
    boards.set(b.id, row);
    const ways: WayInput[] = b.board.ways.map((w, position) => ({
      id: ids.get(w.id)!,
      rail: 0,
      position,
      device: structuredClone(w.device) as WayInput['device'],
      circuit: structuredClone(w.circuit ?? null) as WayInput['circuit'],
    }));
    await Way.bulkCreate(ways.map((w) => ({ ...w, boardId: row.id })));
  }
  return { site, ids, boards, id: (fixtureId: string) => ids.get(fixtureId)! };
}
