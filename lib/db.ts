import pg from 'pg';
import { Sequelize } from 'sequelize';

import { env } from '@/lib/env';

const globalForDb = globalThis as unknown as { boardwrightSequelize?: Sequelize };

/**
 * The one connection pool of this process, cached on globalThis so that hot reloads and every
 * bundle share it. The models register themselves on it when `@/models` is imported.
 */
export function db(): Sequelize {
  return (globalForDb.boardwrightSequelize ??= new Sequelize(env().DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000, acquire: 5_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
  }));
}
