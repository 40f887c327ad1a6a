import crypto from 'node:crypto';

import { Board, Organisation, Site, Way } from '@/models';
import { DEMO_ORG, demoWays, WORKSHOP_BOARD } from '@/scripts/demo-data';

/**
 * A 36-way three-phase board of the demo organisation under a bench-only name (the workshop's
 * ways, repeated), made once and found again by its name on later runs.
 */
export async function benchBoard(name: string): Promise<string> {
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  if (!org) throw new Error('seed the demo first');
  const existing = await Board.findOne({ where: { organisationId: org.id, name } });
  if (existing) return existing.id;
  const site = await Site.findOne({ where: { organisationId: org.id } });
  const board = await Board.create({
    ...WORKSHOP_BOARD.settings,
    name,
    enclosureModules: 72,
    organisationId: org.id,
    siteId: site!.id,
  });
  const all = demoWays(WORKSHOP_BOARD);
  const outgoing = all.filter((w) => w.device.kind !== 'main-switch');
  const ways = [all[0], ...outgoing, ...outgoing.map((w) => ({ ...w, id: crypto.randomUUID() }))];
  await Way.bulkCreate(ways.map((w, position) => ({ ...w, position, rail: 0, boardId: board.id })));
  return board.id;
}
