/**
 * Seeds the demo: idempotent. Users get their demo passwords back and are reactivated
 * on every run; the demo site and boards are only created when missing, so work done
 * in the demo is kept across restarts.
 */
import bcrypt from 'bcryptjs';

import { db } from '@/lib/db';
import { Board, Organisation, Site, User, Way } from '@/models';

import {
  DEMO_ORG,
  DEMO_SITE,
  DEMO_USERS,
  FINISHING_BOARD,
  FLAT_BOARD,
  OTHER_ORG,
  OTHER_USER,
  WORKSHOP_SITE_BOARD,
  WORKSHOP_SUB_MAINS,
  demoWays,
} from './demo-data';

type DemoBoard = typeof FLAT_BOARD;

async function ensureOrg(name: string): Promise<Organisation> {
  const [org] = await Organisation.findOrCreate({ where: { name }, defaults: { name } });
  return org;
}

async function ensureUser(orgId: string, u: (typeof DEMO_USERS)[number]): Promise<User> {
  const passwordHash = await bcrypt.hash(u.password, 10);
  const existing = await User.findOne({ where: { email: u.email } });
  if (existing) {
    await existing.update({ passwordHash, active: true, role: u.role, organisationId: orgId });
    return existing;
  }
  return User.create({ organisationId: orgId, email: u.email, name: u.name, role: u.role, passwordHash });
}

async function createBoard(orgId: string, siteId: string, createdById: string, demo: DemoBoard) {
  const board = await Board.create({
    ...demo.settings,
    organisationId: orgId,
    siteId,
    createdById,
    designChangedById: createdById,
  });
  const ways = demoWays(demo);
  await Way.bulkCreate(ways.map((w) => ({ ...w, boardId: board.id })));
  return { board, ways };
}

/**
 * The demo site as one supply tree: its origin is the workshop's supply intake, Workshop DB1
 * is fed from it, and its two sub-mains feed the finishing room's board and the flat's consumer
 * unit, whose supply values are then carried down (derived), not typed.
 */
async function linkDemoTree(
  siteId: string,
  workshop: Awaited<ReturnType<typeof createBoard>>,
  fedBy: { boardId: string; serves: string }[],
) {
  const { earthing, uoV, zeOhm, pfcKa, source } = WORKSHOP_SITE_BOARD.settings.supply;
  await db().query('UPDATE sites SET origin = $1::jsonb, tree_version = tree_version + 1 WHERE id = $2', {
    bind: [JSON.stringify({ earthing, uoV, zeOhm, pfcKa, source }), siteId],
  });
  for (const { boardId, serves } of fedBy) {
    const way = workshop.ways.find((w) => w.circuit?.serves === serves);
    if (!way) throw new Error(`the demo workshop has no way serving "${serves}"`);
    await db().query('UPDATE boards SET fed_from_way_id = $1 WHERE id = $2', { bind: [way.id, boardId] });
  }
}

async function main() {
  const sequelize = db();
  const org = await ensureOrg(DEMO_ORG);
  const users = [];
  for (const u of DEMO_USERS) users.push(await ensureUser(org.id, u));
  const other = await ensureOrg(OTHER_ORG);
  const otherAdmin = await ensureUser(other.id, OTHER_USER);

  const site = await Site.findOne({ where: { organisationId: org.id, name: DEMO_SITE.name } });
  if (!site) {
    const designer = users.find((u) => u.role === 'designer')!;
    const created = await Site.create({ ...DEMO_SITE, organisationId: org.id });
    const workshop = await createBoard(org.id, created.id, designer.id, WORKSHOP_SITE_BOARD);
    const finishing = await createBoard(org.id, created.id, designer.id, FINISHING_BOARD);
    const flat = await createBoard(org.id, created.id, designer.id, FLAT_BOARD);
    await linkDemoTree(created.id, workshop, [
      { boardId: finishing.board.id, serves: WORKSHOP_SUB_MAINS.finishing.circuit!.serves! },
      { boardId: flat.board.id, serves: WORKSHOP_SUB_MAINS.flat.circuit.serves },
    ]);
  }
  // The second organisation owns one board, so that isolation can be seen and tested.
  const otherSite = await Site.findOne({ where: { organisationId: other.id } });
  if (!otherSite) {
    const s = await Site.create({
      name: 'Mill Cottage',
      address: '2 Weir Road',
      client: 'Private',
      organisationId: other.id,
    });
    await createBoard(other.id, s.id, otherAdmin.id, FLAT_BOARD);
  }

  console.log('Demo accounts (organisation "%s"):', DEMO_ORG);
  for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(9)} ${u.email.padEnd(26)} ${u.password}`);
  console.log(`  (another organisation, "${OTHER_ORG}": ${OTHER_USER.email} / ${OTHER_USER.password})`);
  await sequelize.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
