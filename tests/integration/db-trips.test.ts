/**
 * lib/db.ts `inFewTrips`: statements sent together in the simple protocol, their parameters
 * written in as literals. The values come back from PostgreSQL as they were sent, whatever they
 * hold; a transaction that fails in a trip, or ends without committing, leaves nothing.
 */
import crypto from 'node:crypto';

import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';

import { db, inFewTrips, type Statement } from '@/lib/db';

import { makeOrganisation } from './helpers';

// Rows of a table the app writes (sites), of an organisation of this test's own
let organisationId: string;
const ids = Array.from({ length: 20 }, () => crypto.randomUUID());

beforeAll(async () => {
  organisationId = (await makeOrganisation('Trips')).org.id;
});

const count = async () =>
  (
    await db().query<{ n: number }>('SELECT count(*)::int AS n FROM sites WHERE organisation_id = $1', {
      bind: [organisationId],
      type: QueryTypes.SELECT,
    })
  )[0].n;

/** Inserts site `n` (its id from `ids`) named `name`. */
const insert = (n: number, name = `Site ${n}`): Statement => ({
  sql: 'INSERT INTO sites (id, organisation_id, name) VALUES ($1, $2, $3)',
  bind: [ids[n], organisationId, name],
});

describe('a transaction in few round trips', () => {
  it('sends each value as it is: quotes, backslashes, $1 in a text, line breaks, non-ASCII, JSON', async () => {
    const texts = [
      'O\'Brien\'s "board"',
      'C:\\boards\\db1 \\n not a line break',
      'costs $1 and $2',
      'line one\nline two\ttab',
      'Flat 1 – CU ⚡ ü',
      JSON.stringify({ name: 'Way "3" \\ L2', note: "it's" }),
      '',
    ];
    const [rows] = await inFewTrips((trip) =>
      trip([{ sql: `SELECT ${texts.map((_, i) => `$${i + 1}::text AS v${i}`).join(', ')}`, bind: texts }], 'commit'),
    );
    expect(Object.values(rows[0])).toEqual(texts);
    const [[json]] = await inFewTrips((trip) =>
      trip(
        [
          {
            sql: 'SELECT $1::jsonb AS j, $2::int AS n, $3::boolean AS b, $4::text AS z',
            bind: [texts[5], -7, true, null],
          },
        ],
        'commit',
      ),
    );
    expect(json).toEqual({ j: JSON.parse(texts[5]), n: -7, b: true, z: null });
  });

  it('refuses a NUL character and a value it cannot write', async () => {
    await expect(inFewTrips((trip) => trip([{ sql: 'SELECT $1::text', bind: ['a\0b'] }]))).rejects.toThrow(/NUL/);
    await expect(inFewTrips((trip) => trip([{ sql: 'SELECT $1::int', bind: [Number.NaN] }]))).rejects.toThrow(
      /literal/,
    );
  });

  it('commits what the last trip sends with COMMIT', async () => {
    const before = await count();
    await inFewTrips(async (trip) => {
      await trip([insert(1)]);
      await trip([insert(2)], 'commit');
    });
    expect(await count()).toBe(before + 2);
  });

  it('leaves nothing when a trip fails, or when it ends without committing', async () => {
    const before = await count();
    await expect(
      inFewTrips(async (trip) => {
        await trip([insert(10, 'kept?')]);
        // The primary key taken already: the whole trip fails, COMMIT with it
        await trip([insert(1, 'again')], 'commit');
      }),
    ).rejects.toThrow();
    await inFewTrips(async (trip) => {
      await trip([insert(11, 'never committed')]);
    });
    expect(await count()).toBe(before);
    // The connection went back to the pool in a clean state: the next transaction works
    await inFewTrips((trip) => trip([insert(12)], 'commit'));
    expect(await count()).toBe(before + 1);
  });
});
