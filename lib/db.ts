import pg from 'pg';
import { Sequelize } from 'sequelize';

import { env } from '@/lib/env';

const globalForDb = globalThis as unknown as { boardwrightSequelize?: Sequelize };

/** The leading comment that names a statement to prepare: `/* prepare:name *\/ SELECT …`. */
const PREPARE = /^\/\* prepare:([a-z_]+) \*\//;

/**
 * pg's client, preparing the statements that open with a `prepare:` comment: each connection
 * parses such a statement once and keeps it by its name, and after five executions PostgreSQL
 * may keep one plan for it (plan_cache_mode auto), so the page reads that run on every request
 * skip most of their parsing and planning (about 2 ms of PostgreSQL's CPU for the review page's
 * read). Sequelize hands every statement to `Client.query` as text, so this is where the name
 * can be added. A statement's text under one name must never change while a server runs.
 */
class PreparingClient extends pg.Client {
  // @ts-expect-error pg's overloads; Sequelize calls (text, values, callback) or (text, callback)
  override query(text: unknown, values?: unknown, callback?: unknown) {
    const name = typeof text === 'string' && Array.isArray(values) ? PREPARE.exec(text)?.[1] : undefined;
    // @ts-expect-error as above
    return name ? super.query({ name, text, values }, callback) : super.query(text, values, callback);
  }
}

/**
 * The one connection pool of this process, cached on globalThis so that hot reloads and every
 * bundle share it. The models register themselves on it when `@/models` is imported.
 */
export function db(): Sequelize {
  return (globalForDb.boardwrightSequelize ??= new Sequelize(env().DATABASE_URL, {
    dialect: 'postgres',
    dialectModule: { ...pg, Client: PreparingClient },
    logging: false,
    pool: { max: env().DB_POOL_MAX, min: 0, idle: 10_000, acquire: 5_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
  }));
}

/** One SQL statement and its bind parameters ($1…). */
export type Statement = { sql: string; bind: unknown[] };

/**
 * Writes that touch different tables, sent as one statement: each but the last a data-modifying
 * `WITH` query, their parameters numbered on. They run on one snapshot and see none of each
 * other's rows, so only writes that do not read each other's tables belong together. One round
 * trip instead of several: on these machines each statement costs a socket write that wakes the
 * database, more than the statement itself.
 */
export function asOneStatement(statements: readonly Statement[]): Statement {
  const bind: unknown[] = [];
  const parts = statements.map((s) => {
    const offset = bind.length;
    bind.push(...s.bind);
    return s.sql.replace(/\$(\d+)/g, (_, n: string) => `$${Number(n) + offset}`);
  });
  const last = parts.pop()!;
  return { sql: parts.length ? `WITH ${parts.map((p, i) => `w${i} AS (${p})`).join(', ')} ${last}` : last, bind };
}
