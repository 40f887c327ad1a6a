import pg from 'pg';
import { Sequelize } from 'sequelize';

import { env } from '@/lib/env';
import { setupModels } from '@/models';

const globalForDb = globalThis as unknown as { boardwrightSequelize?: Sequelize };

/**
 * The one connection pool of this process, with every model registered. Cached on
 * globalThis so that hot reloads and route bundles share it.
 */
export function db(): Sequelize {
  if (globalForDb.boardwrightSequelize) return globalForDb.boardwrightSequelize;
  const sequelize = new Sequelize(env().DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000, acquire: 5_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
  });
  setupModels(sequelize);
  globalForDb.boardwrightSequelize = sequelize;
  return sequelize;
}
