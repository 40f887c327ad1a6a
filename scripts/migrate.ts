/** Applies (default) or rolls back migrations: tsx scripts/migrate.ts [up|down|down-all] */
import { db } from '@/lib/db';
import { migrator } from '@/lib/migrator';

async function main() {
  const direction = process.argv[2] ?? 'up';
  const umzug = migrator(db());
  if (direction === 'up') {
    const done = await umzug.up();
    console.log(`migrations applied: ${done.length ? done.map((m) => m.name).join(', ') : 'none pending'}`);
  } else if (direction === 'down') {
    const done = await umzug.down();
    console.log(`rolled back: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (direction === 'down-all') {
    const done = await umzug.down({ to: 0 });
    console.log(`rolled back: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else {
    throw new Error(`unknown direction ${direction}`);
  }
  await db().close();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
