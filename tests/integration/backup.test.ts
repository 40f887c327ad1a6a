/**
 * Backup and restore: scripts/backup.sh dumps the test database, scripts/restore.sh loads it
 * into a scratch database, and the boards, their ways, sites and audit trail come back exactly.
 */
import { execFile } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';

import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import { deleteObjects, getObjectBytes, putObject } from '@/lib/storage/s3';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

const ROOT = path.resolve(import.meta.dirname, '../..');
const SOURCE_URL = process.env.DATABASE_URL!;
const SCRATCH = `bw_restore_${crypto.randomUUID().slice(0, 8)}`;
// The app's role and the owner's: the scripts back up and restore as the owner
const OWNER_URL = process.env.DATABASE_OWNER_URL ?? SOURCE_URL;
const scratchUrl = (of = SOURCE_URL) => {
  const url = new URL(of);
  url.pathname = `/${SCRATCH}`;
  return url.href;
};
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'bw-backup-'));
const dumpFile = path.join(dir, 'boardwright.dump');

/** Runs one of the project's scripts against the test database. */
function script(name: string, args: string[], env: Record<string, string> = { DATABASE_URL: SOURCE_URL }) {
  return promisify(execFile)('bash', [`scripts/${name}`, ...args], {
    cwd: ROOT,
    env: { ...process.env, ...env },
    encoding: 'utf8',
    timeout: 120_000,
  });
}

/** scripts/files.ts, as the scripts run it. */
function files(command: 'backup' | 'restore', folder: string) {
  return promisify(execFile)('node_modules/.bin/tsx', ['scripts/files.ts', command, folder], {
    cwd: ROOT,
    env: process.env,
    encoding: 'utf8',
    timeout: 120_000,
  });
}

const sha256 = (data: Uint8Array) => crypto.createHash('sha256').update(data).digest('hex');

/** Rows of one organisation, from a database, in a stable order. */
async function rowsOf(url: string, organisationId: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const q = async (sql: string) => (await client.query(sql, [organisationId])).rows;
    return {
      organisation: await q('select * from organisations where id = $1'),
      users: await q('select * from users where organisation_id = $1 order by id'),
      sites: await q('select * from sites where organisation_id = $1 order by id'),
      boards: await q('select * from boards where organisation_id = $1 order by id'),
      ways: await q(
        'select w.* from ways w join boards b on b.id = w.board_id where b.organisation_id = $1 order by w.id',
      ),
      audit: await q('select * from audit_events where organisation_id = $1 order by id'),
    };
  } finally {
    await client.end();
  }
}

let organisationId: string;
let before: Awaited<ReturnType<typeof rowsOf>>;

beforeAll(async () => {
  // Two boards, one of them saved with changes so the audit trail has entries
  const { org, users } = await makeOrganisation('Backup');
  organisationId = org.id;
  await makeBoard(org.id, 'flat');
  const { board } = await makeBoard(org.id, 'workshop');
  signInAs(users.designer);
  const opened: BoardDto = (await (await boardRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).json()).board;
  const body = saveBodyOf(opened);
  body.settings.location = 'Plant room, east wall';
  body.ways = body.ways.slice(0, -1);
  expect((await boardRoute.PUT(jsonRequest('PUT', body), ctx({ boardId: board.id }))).status).toBe(200);
  before = await rowsOf(SOURCE_URL, organisationId);
});

afterAll(async () => {
  const admin = new pg.Client({ connectionString: OWNER_URL.replace(/\/[^/?]+(\?|$)/, '/postgres$1') });
  await admin.connect();
  // A session the test closed on the restored copy can still be on its way out, and the owner
  // may not end a session of the app role (force would fail): wait up to 5 s for it to go
  for (let i = 0; i < 50; i++) {
    const { rows } = await admin.query<{ n: number }>(
      'select count(*)::int as n from pg_stat_activity where datname = $1',
      [SCRATCH],
    );
    if (rows[0].n === 0) break;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  await admin.query(`drop database if exists "${SCRATCH}" with (force)`);
  await admin.end();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  it('round trip: the boards, ways, sites and audit trail come back exactly', async () => {
    expect(before.boards).toHaveLength(2);
    expect(before.ways.length).toBeGreaterThan(10);
    expect(before.audit.length).toBeGreaterThan(0);

    const backup = await script('backup.sh', [dumpFile]);
    expect(backup.stdout).toMatch(/Backed up database \w+ to .*boardwright\.dump/);
    expect(fs.statSync(dumpFile).size).toBeGreaterThan(10_000);
    // pg_dump's custom format starts with PGDMP
    expect(fs.readFileSync(dumpFile).subarray(0, 5).toString()).toBe('PGDMP');

    const restore = await script('restore.sh', [dumpFile, SCRATCH]);
    expect(restore.stdout).toContain(`Created database ${SCRATCH}`);
    // Into another database than the app's: the photos beside the dump are left where they are
    expect(restore.stdout).toContain(`The photos in ${dumpFile}.files were not put back`);
    expect(await rowsOf(scratchUrl(), organisationId)).toEqual(before);
  });

  it('the restored database keeps its rules: the audit trail still refuses changes', async () => {
    // Its triggers, even for the owner
    const owner = new pg.Client({ connectionString: scratchUrl(OWNER_URL) });
    await owner.connect();
    try {
      await expect(owner.query("update audit_events set action = 'x'")).rejects.toThrow(/append-only/);
      await expect(owner.query('delete from audit_events')).rejects.toThrow(/append-only/);
      const { rows } = await owner.query('select count(*)::int as n from schema_migrations');
      expect(rows[0].n).toBeGreaterThanOrEqual(2);
    } finally {
      await owner.end();
    }
    // And the app role's grants, given again by the restore: it reads and appends, no more
    const app = new pg.Client({ connectionString: scratchUrl() });
    await app.connect();
    try {
      expect((await app.query('select count(*)::int as n from boards')).rows[0].n).toBeGreaterThan(0);
      await app.query("insert into audit_events (organisation_id, action) values (gen_random_uuid(), 'board.saved')");
      await expect(app.query("update audit_events set action = 'x'")).rejects.toThrow(/permission denied/);
      await expect(app.query('truncate audit_events')).rejects.toThrow(/permission denied/);
    } finally {
      await app.end();
    }
  });

  it('restoring over a database with tables needs --yes, then replaces its contents', async () => {
    // Damage the scratch copy
    const client = new pg.Client({ connectionString: scratchUrl() });
    await client.connect();
    await client.query('delete from ways where board_id = $1', [before.boards[0].id]);
    await client.query("update boards set name = 'Damaged' where organisation_id = $1", [organisationId]);
    await client.end();

    await expect(script('restore.sh', [dumpFile, SCRATCH])).rejects.toMatchObject({
      stderr: expect.stringContaining('add --yes to replace them'),
    });
    await script('restore.sh', [dumpFile, SCRATCH, '--yes']);
    expect(await rowsOf(scratchUrl(), organisationId)).toEqual(before);
  });

  it('refuses a file that is not a backup, and a bad database name', async () => {
    const junk = path.join(dir, 'not-a-backup.dump');
    fs.writeFileSync(junk, 'hello');
    await expect(script('restore.sh', [junk, SCRATCH])).rejects.toMatchObject({
      stderr: expect.stringContaining('Not a pg_dump custom-format file'),
    });
    await expect(script('restore.sh', [dumpFile, 'x"; drop database y; --'])).rejects.toMatchObject({
      stderr: expect.stringContaining('letters, digits and _ only'),
    });
  });
});

describe('the photos in object storage', () => {
  /** A photo's object as the app stores one, and a stored print, in the bucket. */
  async function storedPhoto() {
    const key = `org/${organisationId}/boards/${crypto.randomUUID()}/photos/${crypto.randomUUID()}/original.png`;
    const bytes = new Uint8Array(crypto.randomBytes(5000));
    await putObject(key, bytes, 'image/png');
    await putObject(
      `prints/${crypto.randomUUID()}/rev-1/labels.pdf`,
      new Uint8Array([37, 80, 68, 70]),
      'application/pdf',
    );
    return { key, bytes };
  }

  it('are copied beside the dump, stored prints left out, and put back byte for byte', async () => {
    const photo = await storedPhoto();
    const file = path.join(dir, 'with-photos.dump');
    const backup = await script('backup.sh', [file]);
    expect(backup.stdout).toMatch(/Backed up \d+ files \(\d+ KiB\) of bucket \S+ to .*with-photos\.dump\.files/);
    const manifest = JSON.parse(fs.readFileSync(`${file}.files/manifest.json`, 'utf8')) as {
      objects: { key: string; bytes: number; sha256: string; contentType: string }[];
    };
    expect(manifest.objects.find((o) => o.key === photo.key)).toEqual({
      key: photo.key,
      bytes: 5000,
      sha256: sha256(photo.bytes),
      contentType: 'image/png',
    });
    // A stored print is a render of a revision in the database: not a record to keep
    expect(manifest.objects.filter((o) => o.key.startsWith('prints/'))).toEqual([]);

    // Lost from storage, then put back by the restore into the app's database (here the scratch
    // copy stands for it: the settings name it as the app's)
    await deleteObjects([photo.key]);
    expect(await getObjectBytes(photo.key)).toBeNull();
    const restore = await script('restore.sh', [file, '--yes'], {
      DATABASE_URL: scratchUrl(),
      DATABASE_OWNER_URL: scratchUrl(OWNER_URL),
    });
    expect(restore.stdout).toContain(`Restored ${file} into database ${SCRATCH}`);
    expect(restore.stdout).toMatch(/Restored \d+ files into bucket/);
    expect(Buffer.from((await getObjectBytes(photo.key))!).equals(Buffer.from(photo.bytes))).toBe(true);
  });

  it('a copy changed since the backup stops the restore before anything is put back', async () => {
    const photo = await storedPhoto();
    const other = await storedPhoto();
    const folder = path.join(dir, 'photos-only');
    await files('backup', folder);
    await expect(files('backup', folder)).rejects.toMatchObject({ stderr: expect.stringContaining('exists already') });
    await deleteObjects([photo.key, other.key]);
    // One copy altered on disk
    const copy = path.join(folder, 'objects', ...other.key.split('/'));
    fs.writeFileSync(copy, Buffer.from('not the photo'));
    await expect(files('restore', folder)).rejects.toMatchObject({
      stderr: expect.stringContaining(`Changed since the backup (its SHA-256 differs): ${other.key}`),
    });
    // Nothing was put back, not even the copies that were sound
    expect(await getObjectBytes(photo.key)).toBeNull();
    expect(await getObjectBytes(other.key)).toBeNull();
  });
});
