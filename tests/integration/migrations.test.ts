import crypto from 'node:crypto';

import pg from 'pg';
import { Sequelize } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';

import { migrator } from '@/lib/migrator';

// A database of its own, so that rolling back never touches the other tests' data.
// As the owner, as scripts/migrate.ts runs them
const base = new URL(process.env.DATABASE_OWNER_URL ?? process.env.DATABASE_URL!);
const name = `${base.pathname.slice(1)}_migrations`;

async function admin(sql: string) {
  const client = new pg.Client({ connectionString: base.href.replace(base.pathname, '/postgres') });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

let sequelize: Sequelize | undefined;

afterAll(async () => {
  await sequelize?.close();
  await admin(`drop database if exists "${name}" with (force)`);
});

describe('migrations', () => {
  it('run up, all the way down and up again cleanly', async () => {
    await admin(`drop database if exists "${name}" with (force)`);
    await admin(`create database "${name}"`);
    const url = new URL(base.href);
    url.pathname = `/${name}`;
    sequelize = new Sequelize(url.href, { dialect: 'postgres', dialectModule: pg, logging: false });
    const umzug = migrator(sequelize);
    const all = (await umzug.pending()).map((m) => m.name);
    expect(all.length).toBeGreaterThan(0);

    await umzug.up();
    const tables = async () =>
      (
        await sequelize!.query(
          "select table_name from information_schema.tables where table_schema = 'public' order by 1",
          { plain: false, raw: true },
        )
      )[0].map((r) => (r as { table_name: string }).table_name);
    const up = await tables();
    expect(up).toEqual(expect.arrayContaining(['boards', 'ways', 'users', 'audit_events', 'outgoing_mail']));

    await umzug.down({ to: 0 });
    expect(await tables()).toEqual(['schema_migrations']);

    await umzug.up();
    expect(await tables()).toEqual(up);
    expect((await umzug.executed()).map((m) => m.name)).toEqual(all);
  });

  it('0007 renames the stage "verified" to "labels-matched" and back, keeping every board', async () => {
    const url = new URL(base.href);
    url.pathname = `/${name}`;
    const client = new pg.Client({ connectionString: url.href });
    await client.connect();
    const umzug = migrator(sequelize!);
    try {
      // Back to before 0007, where boards are stored as `verified`
      await umzug.down({ to: '0007-labels-matched-status.ts' });
      const org = crypto.randomUUID();
      const site = crypto.randomUUID();
      await client.query('insert into organisations (id, name) values ($1, $2)', [org, 'Migration test']);
      await client.query('insert into sites (id, organisation_id, name) values ($1, $2, $3)', [site, org, 'Site']);
      const boards = ['verified', 'issued', 'draft'].map((status) => ({ id: crypto.randomUUID(), status }));
      for (const b of boards) {
        await client.query(
          `insert into boards (id, organisation_id, site_id, name, phases, supply, incoming, enclosure_modules, status)
           values ($1, $2, $3, $4, 1, '{}', '{}', 12, $5)`,
          [b.id, org, site, `Board ${b.status}`, b.status],
        );
      }
      const statuses = async () =>
        (await client.query('select id, status from boards where organisation_id = $1', [org])).rows.map(
          (r: { id: string; status: string }) => [r.id, r.status],
        );
      const byName = (list: string[]) => boards.map((b, i) => [b.id, list[i]]);

      await umzug.up();
      expect(await statuses()).toEqual(expect.arrayContaining(byName(['labels-matched', 'issued', 'draft'])));
      expect(await statuses()).toHaveLength(3);
      await expect(client.query(`select 'verified'::enum_boards_status`)).rejects.toThrow(/invalid input value/);

      await umzug.down({ to: '0007-labels-matched-status.ts' });
      expect(await statuses()).toEqual(expect.arrayContaining(byName(['verified', 'issued', 'draft'])));
      await umzug.up();
      await client.query('delete from organisations where id = $1', [org]);
    } finally {
      await client.end();
    }
  });

  it('the audit trail refuses updates and deletes', async () => {
    const url = new URL(base.href);
    url.pathname = `/${name}`;
    const client = new pg.Client({ connectionString: url.href });
    await client.connect();
    try {
      await client.query(
        "insert into audit_events (organisation_id, action) values (gen_random_uuid(), 'board.saved')",
      );
      await expect(client.query("update audit_events set action = 'x'")).rejects.toThrow(/append-only/);
      await expect(client.query('delete from audit_events')).rejects.toThrow(/append-only/);
      await expect(client.query('truncate audit_events')).rejects.toThrow(/append-only/);
    } finally {
      await client.end();
    }
  });
});

describe('the audit trail from the app', () => {
  it('the app’s own models cannot change or remove an event', async () => {
    const { db } = await import('@/lib/db');
    const { AuditEvent } = await import('@/models');
    db();
    const event = await AuditEvent.create({
      organisationId: crypto.randomUUID(),
      action: 'board.saved',
      details: { version: 2 },
    });
    // The app's role has no UPDATE or DELETE on the table (lib/db-roles.ts, granted by
    // scripts/migrate.ts after every migration); the triggers
    // would refuse them anyway
    const refused = /permission denied for table audit_events|append-only/;
    await expect(event.update({ action: 'board.deleted' })).rejects.toThrow(refused);
    await expect(AuditEvent.update({ details: {} }, { where: { id: event.id } })).rejects.toThrow(refused);
    await expect(event.destroy()).rejects.toThrow(refused);
    await expect(AuditEvent.destroy({ where: { id: event.id } })).rejects.toThrow(refused);
    const stored = await AuditEvent.findByPk(event.id);
    expect(stored?.action).toBe('board.saved');
    expect(stored?.details).toEqual({ version: 2 });
  });

  it('the app connects as a role that owns nothing, so it cannot drop or disable the triggers', async () => {
    const { db } = await import('@/lib/db');
    const sequelize = db();
    const [[who]] = (await sequelize.query(
      `select current_user as me, (select tableowner from pg_tables where tablename = 'audit_events') as owner`,
    )) as [{ me: string; owner: string }[], unknown];
    expect(who.me).not.toBe(who.owner);
    for (const sql of [
      'alter table audit_events disable trigger audit_events_no_update',
      'drop trigger audit_events_no_update on audit_events',
      'truncate audit_events',
      'delete from schema_migrations',
    ]) {
      await expect(sequelize.query(sql), sql).rejects.toThrow(/must be owner|permission denied/);
    }
    // What it needs it has: read, write, append to the trail
    await sequelize.query(
      "insert into audit_events (organisation_id, action) values (gen_random_uuid(), 'board.saved')",
    );
    expect((await sequelize.query('select count(*) from boards'))[0]).toHaveLength(1);
  });
});
