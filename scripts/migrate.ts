/**
 * Applies (default) or rolls back migrations, as the database owner (DATABASE_OWNER_URL, or
 * DATABASE_URL when there is no separate owner): tsx scripts/migrate.ts [up|down|down-all|grants]
 * After `up`, and alone with `grants`, the app role (the user in DATABASE_URL, when it is
 * another role) gets its grants (lib/db-roles.ts); they are given every time, so a database
 * first migrated with one role for everything, or restored from a backup, gets them too.
 */
import pg from 'pg';
import { Sequelize } from 'sequelize';

import { appRoleGrantsSql, separateAppRole } from '@/lib/db-roles';
import { env } from '@/lib/env';
import { migrator } from '@/lib/migrator';

async function grant(sequelize: Sequelize) {
  const role = await separateAppRole(sequelize);
  if (role) await sequelize.query(appRoleGrantsSql(role));
  console.log(role ? `grants of the app role ${role}: given` : 'no separate app role: nothing to grant');
}

async function main() {
  const direction = process.argv[2] ?? 'up';
  const sequelize = new Sequelize(process.env.DATABASE_OWNER_URL || env().DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
  });
  const umzug = migrator(sequelize);
  if (direction === 'up') {
    const done = await umzug.up();
    console.log(`migrations applied: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending'}`);
    await grant(sequelize);
  } else if (direction === 'down') {
    const done = await umzug.down();
    console.log(`rolled back: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (direction === 'down-all') {
    const done = await umzug.down({ to: 0 });
    console.log(`rolled back: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (direction === 'grants') {
    await grant(sequelize);
  } else {
    throw new Error(`unknown direction ${direction}`);
  }
  await sequelize.close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
