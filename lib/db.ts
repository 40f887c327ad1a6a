import pg from 'pg';
import { Sequelize } from 'sequelize';

import { env } from '@/lib/env';
import { setupModels } from '@/models';

const globalForDb = globalThis as unknown as { boardwrightSequelize?: Sequelize };

// Next bundles server code per layer (route handlers, pages), each with its own copy of
// the model classes: every copy must be registered, while the pool is shared.
let modelsReady = false;

/**
 * The one connection pool of this process, with every model registered. The pool is
 * cached on globalThis so that hot reloads and every bundle share it.
 */
export function db(): Sequelize {
  const sequelize = globalForDb.boardwrightSequelize ?? connect();
  if (!modelsReady) {
    setupModels(sequelize);
    modelsReady = true;
  }
  return sequelize;
}

function connect(): Sequelize {
  const sequelize = new Sequelize(env().DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000, acquire: 5_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
  });
  globalForDb.boardwrightSequelize = sequelize;
  return sequelize;
}

type PooledClient = {
  query: (q: { name: string; text: string; values: unknown[] }) => Promise<{ rows: unknown[] }>;
};
type Pool = {
  getConnection: (options: { type: string }) => Promise<PooledClient>;
  releaseConnection: (client: PooledClient) => void;
};

/**
 * One named statement on a connection of Sequelize's pool, straight through pg: for the hot
 * paths (the board read, the save), where Sequelize's query layers cost more than the
 * statement itself. Named, the statement is parsed and planned once per connection. Errors are
 * pg's own (`code`, `constraint`, `severity`), which lib/api/handler.ts maps as it maps
 * Sequelize's.
 */
export async function namedQuery<R>(name: string, text: string, values: unknown[]): Promise<R[]> {
  const pool = (db() as unknown as { connectionManager: Pool }).connectionManager;
  const client = await pool.getConnection({ type: 'SELECT' });
  try {
    return (await client.query({ name, text, values })).rows as R[];
  } finally {
    pool.releaseConnection(client);
  }
}
