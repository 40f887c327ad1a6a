/**
 * Statements that open with a `prepare:` comment are prepared once per connection and kept by
 * their name (lib/db.ts); others are not. Checked in PostgreSQL's own view of the session's
 * prepared statements (pg_prepared_statements), inside one transaction so that every statement
 * runs on the same connection.
 */
import pg from 'pg';
import { QueryTypes } from 'sequelize';
import { describe, expect, it, vi } from 'vitest';

import type { Actor } from '@/lib/auth/session';
import { getReviewSource } from '@/lib/dal/review-page';
import { db } from '@/lib/db';

import { makeBoard, makeOrganisation } from './helpers';

async function preparedNames(transaction: Awaited<ReturnType<ReturnType<typeof db>['transaction']>>) {
  const rows = await db().query<{ name: string }>('SELECT name FROM pg_prepared_statements ORDER BY name', {
    type: QueryTypes.SELECT,
    transaction,
  });
  return rows.map((r) => r.name);
}

describe('prepared statements (lib/db.ts)', () => {
  it('prepares a statement named by its comment once per connection, and only such a statement', async () => {
    await db().transaction(async (transaction) => {
      const named = '/* prepare:probe_statement */ SELECT $1::int + 1 AS n';
      for (const n of [1, 2]) {
        const [row] = await db().query<{ n: number }>(named, { bind: [n], type: QueryTypes.SELECT, transaction });
        expect(row.n).toBe(n + 1);
      }
      await db().query('SELECT $1::int AS unnamed', { bind: [3], type: QueryTypes.SELECT, transaction });
      const names = await preparedNames(transaction);
      expect(names).toContain('probe_statement');
      expect(names.filter((n) => n === 'probe_statement')).toHaveLength(1);
      expect(names.every((n) => n !== '' && !n.startsWith('unnamed'))).toBe(true);
    });
  });

  it('a statement without bind values runs as plain text even with the comment', async () => {
    await db().transaction(async (transaction) => {
      await db().query('/* prepare:no_values */ SELECT 1', { type: QueryTypes.SELECT, transaction });
      expect(await preparedNames(transaction)).not.toContain('no_values');
    });
  });

  it('the review page reads its board with the prepared review statement, the same answer every time', async () => {
    const team = await makeOrganisation('Prepared');
    const { inspector } = team.users;
    const actor: Actor = {
      userId: inspector.id,
      organisationId: team.org.id,
      role: 'inspector',
      name: inspector.name,
      email: inspector.email,
    };
    const { board } = await makeBoard(team.org.id);
    await getReviewSource(actor, board.id); // sizes the new board and stores its sizing
    const query = vi.spyOn(pg.Client.prototype, 'query');
    // More than five executions: PostgreSQL may then switch the statement to a generic plan
    const answers: Awaited<ReturnType<typeof getReviewSource>>[] = [];
    for (let i = 0; i < 7; i++) answers.push(await getReviewSource(actor, board.id));
    const named = query.mock.calls.filter(([config]) => (config as { name?: string })?.name === 'review_source');
    query.mockRestore();
    expect(named).toHaveLength(7);
    expect(answers.every((a) => JSON.stringify(a) === JSON.stringify(answers[0]))).toBe(true);
    expect(answers[0].board.id).toBe(board.id);
  });
});
