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

/** A value of a bind parameter as an SQL literal (the simple protocol has no parameters). */
function literal(value: unknown): string {
  if (value === null || value === undefined) return 'NULL';
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (typeof value === 'number' && Number.isFinite(value)) return String(value);
  if (typeof value === 'string') {
    // An escape string (E'…', whatever standard_conforming_strings says): backslashes and
    // quotes doubled, as pg's escapeLiteral does it, with the engine's own replaceAll (pg's
    // loop over each character cost a millisecond for a site's writes)
    if (value.includes('\0')) throw new TypeError('A text value holds a NUL character');
    return `E'${value.replaceAll('\\', '\\\\').replaceAll("'", "''")}'`;
  }
  throw new TypeError(`No literal for a bind value of type ${typeof value}`);
}

/** The statement with its parameters written in as literals ($1… replaced once, left to right). */
const withLiterals = ({ sql, bind }: Statement): string =>
  sql.replace(/\$(\d+)/g, (_, n: string) => literal(bind[Number(n) - 1]));

/** Sends statements in one round trip, and answers the rows of each (none for BEGIN and COMMIT). */
export type Trip = (statements: readonly Statement[], end?: 'commit') => Promise<Record<string, unknown>[][]>;

/**
 * A transaction in as few round trips as it has steps, on a connection of the pool taken for it
 * alone: the first trip opens it (BEGIN goes with its statements), `trip(…, 'commit')` sends the
 * last statements with COMMIT, and any error (or `f` returning before it committed) rolls it
 * back. In one trip the statements go as one text (the simple protocol, parameters written in as
 * literals: escape strings, see `literal`), and each still runs on a snapshot of its own: a read sent after a
 * lock sees what was committed before the lock was granted. For a write whose every step counts
 * (each trip wakes the database: on these machines that costs more than the statements).
 */
export async function inFewTrips<T>(f: (trip: Trip) => Promise<T>): Promise<T> {
  const pool = db().connectionManager as unknown as {
    getConnection(): Promise<pg.Client>;
    releaseConnection(client: pg.Client): Promise<void>;
  };
  const client = await pool.getConnection();
  const tx: { state: 'none' | 'open' | 'done' } = { state: 'none' };
  const trip: Trip = async (statements, end) => {
    if (tx.state === 'done') throw new Error('The transaction has ended.');
    const texts = [...(tx.state === 'none' ? ['BEGIN'] : []), ...statements.map(withLiterals)];
    if (end === 'commit') texts.push('COMMIT');
    tx.state = 'open';
    const out = (await client.query(texts.join(';\n'))) as unknown as pg.QueryResult | pg.QueryResult[];
    if (end === 'commit') tx.state = 'done';
    return (Array.isArray(out) ? out : [out])
      .filter((r) => r.command !== 'BEGIN' && r.command !== 'COMMIT')
      .map((r) => r.rows as Record<string, unknown>[]);
  };
  try {
    return await f(trip);
  } finally {
    if (tx.state === 'open') await client.query('ROLLBACK').catch(() => undefined);
    await pool.releaseConnection(client);
  }
}
