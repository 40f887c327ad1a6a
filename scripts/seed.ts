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
  FLAT_BOARD,
  OTHER_ORG,
  OTHER_USER,
  WORKSHOP_BOARD,
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
  await Way.bulkCreate(demoWays(demo).map((w) => ({ ...w, boardId: board.id })));
  return board;
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
    await createBoard(org.id, created.id, designer.id, WORKSHOP_BOARD);
    await createBoard(org.id, created.id, designer.id, FLAT_BOARD);
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
