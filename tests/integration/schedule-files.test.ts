/**
 * Printing off the request path: an issued revision's schedule and label strips are rendered
 * once and then served from object storage (the S3 fake); a change on the label walk gives the
 * schedule a new file; drafts are rendered every time, in the print pool's worker threads.
 * The worker is bundled here the way `npm run build` bundles it (scripts/build-workers.mjs).
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { threadId } from 'node:worker_threads';

import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';

import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as labelsRoute from '@/app/api/boards/[boardId]/labels/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as labelRoute from '@/app/api/boards/[boardId]/ways/[wayId]/label/route';
import { storedKey } from '@/features/schedule/print/print-files';
import * as pool from '@/features/schedule/print/print-pool';
import { getScheduleSource } from '@/lib/dal/schedule-source';
import * as storage from '@/lib/storage/s3';
import { getObjectBytes } from '@/lib/storage/s3';

import { noAnswer } from '../stubs/storage-away';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

vi.mock('@/features/schedule/print/print-pool', async (importActual) => {
  const actual = await importActual<typeof import('@/features/schedule/print/print-pool')>();
  return { ...actual, renderInPool: vi.fn(actual.renderInPool) };
});

const renders = vi.mocked(pool.renderInPool);
type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let other: Org;
const workerFile = path.join(process.cwd(), '.data', `print-worker-test-${crypto.randomUUID().slice(0, 8)}.mjs`);

beforeAll(async () => {
  // Inside the checkout, so that the bundle's package imports resolve from node_modules
  const { buildPrintWorker } = (await import(path.join(process.cwd(), 'scripts/build-workers.mjs'))) as {
    buildPrintWorker: (out: string) => Promise<string>;
  };
  await buildPrintWorker(workerFile);
  process.env.PRINT_WORKER_FILE = workerFile;
  team = await makeOrganisation('Files');
  other = await makeOrganisation('Files elsewhere');
}, 60_000);

afterAll(async () => {
  await pool.closePrintPool();
  fs.rmSync(workerFile, { force: true });
});

/** The installer as the DAL takes them. */
const installer = () => {
  const u = team.users.installer;
  return { userId: u.id, organisationId: u.organisationId, role: u.role, name: u.name, email: u.email };
};

async function issuedBoard() {
  const { board } = await makeBoard(team.org.id, 'flat');
  await board.update({ status: 'in-review' });
  signInAs(team.users.inspector);
  const res = await approveRoute.POST(
    jsonRequest('POST', { declaration: team.users.inspector.name }),
    ctx({ boardId: board.id }),
  );
  expect(res.status).toBe(200);
  return board;
}

async function download(route: typeof scheduleRoute | typeof labelsRoute, boardId: string) {
  const res = await route.GET(jsonRequest('GET', undefined, 'http://127.0.0.1/x?download=1'), ctx({ boardId }));
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toBe('application/pdf');
  return { bytes: new Uint8Array(await res.arrayBuffer()), timing: res.headers.get('server-timing') ?? '', res };
}

async function pdfText(bytes: Uint8Array) {
  const parser = new PDFParse({ data: bytes.slice() });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

describe('an issued revision', () => {
  it('is rendered once, stored, and then served from storage', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const before = renders.mock.calls.length;
    const first = await download(scheduleRoute, board.id);
    expect(first.timing).toMatch(/^render;/);
    expect(renders.mock.calls.length).toBe(before + 1);
    expect(first.res.headers.get('content-disposition')).toBe(
      'attachment; filename="schedule-flat-1-consumer-unit-rev1.pdf"',
    );
    // In storage, under the revision and its label state
    const source = await getScheduleSource(installer(), board.id);
    const stored = await getObjectBytes(storedKey('schedule', source, new Date()));
    expect(stored && Buffer.from(stored).equals(Buffer.from(first.bytes))).toBe(true);

    const second = await download(scheduleRoute, board.id);
    expect(second.timing).toMatch(/^stored;/);
    expect(renders.mock.calls.length).toBe(before + 1);
    expect(Buffer.from(second.bytes).equals(Buffer.from(first.bytes))).toBe(true);
    expect(second.res.headers.get('content-length')).toBe(String(first.bytes.byteLength));
  });

  it('is sent from the process’s memory once read or stored, and storage is asked only for a file not kept', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const first = await download(scheduleRoute, board.id);
    expect(first.timing).toMatch(/^render;/);
    const key = storedKey('schedule', await getScheduleSource(installer(), board.id), new Date());
    const reads = vi.spyOn(storage, 'getObjectBytes');
    try {
      // Stored by this process a moment ago: kept, so storage is not read again
      const again = await download(scheduleRoute, board.id);
      expect(again.timing).toMatch(/^stored;/);
      expect(Buffer.from(again.bytes).equals(Buffer.from(first.bytes))).toBe(true);
      expect(reads.mock.calls.filter(([k]) => k === key)).toHaveLength(0);
      // Another organisation's member still gets 404: the facts are read on every request
      signInAs(other.users.installer);
      expect((await scheduleRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).status).toBe(404);
    } finally {
      reads.mockRestore();
    }
  });

  it('is rendered and answered all the same while the file storage is away, and stored once it is back', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    // Every storage call fails as the SDK fails when nothing answers
    const send = vi.spyOn(storage.s3(), 'send').mockRejectedValue((await noAnswer()) as never);
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    const before = renders.mock.calls.length;
    let away: Uint8Array;
    try {
      const first = await download(scheduleRoute, board.id);
      expect(first.timing).toMatch(/^render;/);
      expect(await pdfText(first.bytes)).toContain('Flat 1 consumer unit');
      // Not stored, so not kept: rendered again while the storage is still away
      const second = await download(scheduleRoute, board.id);
      expect(second.timing).toMatch(/^render;/);
      expect(renders.mock.calls.length).toBe(before + 2);
      expect(send).toHaveBeenCalled();
      const said = warn.mock.calls.map(([m]) => String(m));
      expect(said.some((m) => m.includes('not stored'))).toBe(true);
      expect(said.some((m) => m.includes('rendered instead'))).toBe(true);
      away = first.bytes;
    } finally {
      send.mockRestore();
      warn.mockRestore();
    }
    // Back: rendered once more and stored, then answered from storage, the same file
    expect((await download(scheduleRoute, board.id)).timing).toMatch(/^render;/);
    const stored = await download(scheduleRoute, board.id);
    expect(stored.timing).toMatch(/^stored;/);
    expect(stored.bytes.byteLength).toBe(away.byteLength);
  });

  it('is rendered once when several ask for it before it is stored', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const before = renders.mock.calls.length;
    const answers = await Promise.all([1, 2, 3].map(() => download(scheduleRoute, board.id)));
    expect(renders.mock.calls.length).toBe(before + 1);
    for (const a of answers) expect(Buffer.from(a.bytes).equals(Buffer.from(answers[0].bytes))).toBe(true);
    expect((await download(scheduleRoute, board.id)).timing).toMatch(/^stored;/);
  });

  it('gets a new schedule file when a label is checked on the walk, and keeps its label strips', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const start = renders.mock.calls.length;
    const unwalked = await download(scheduleRoute, board.id);
    const strips = await download(labelsRoute, board.id);
    expect(renders.mock.calls.length).toBe(start + 2);
    const wayId = (await getScheduleSource(installer(), board.id)).snapshot.ways.find((w) => w.circuit)!.id;
    const res = await labelRoute.POST(
      jsonRequest('POST', { status: 'wrong', note: 'Faded label, reprint' }),
      ctx({ boardId: board.id, wayId }),
    );
    expect(res.status).toBe(200);

    const walked = await download(scheduleRoute, board.id);
    expect(walked.timing).toMatch(/^render;/);
    expect(renders.mock.calls.length).toBe(start + 3);
    expect(await pdfText(unwalked.bytes)).not.toContain('Faded label, reprint');
    expect(await pdfText(walked.bytes)).toContain('Faded label, reprint');
    // The new state is stored in turn; the label strips do not print the walk and stay stored
    expect((await download(scheduleRoute, board.id)).timing).toMatch(/^stored;/);
    const stripsAgain = await download(labelsRoute, board.id);
    expect(stripsAgain.timing).toMatch(/^stored;/);
    expect(Buffer.from(stripsAgain.bytes).equals(Buffer.from(strips.bytes))).toBe(true);
    expect(renders.mock.calls.length).toBe(start + 3);
  });
});

describe('a stored file and the browser', () => {
  const withTag = (etag: string) =>
    new Request('http://127.0.0.1/x?download=1', { headers: { 'if-none-match': etag } });

  it('carries a strong ETag; If-None-Match with it is a 304 without a body or a render, until the walk changes it', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const first = await download(scheduleRoute, board.id);
    const etag = first.res.headers.get('etag')!;
    expect(etag).toMatch(/^"[\w-]+"$/);
    expect(first.res.headers.get('cache-control')).toBe('private, no-cache');
    const stored = await download(scheduleRoute, board.id);
    expect(stored.timing).toMatch(/^stored;/);
    expect(stored.res.headers.get('etag')).toBe(etag);

    const start = renders.mock.calls.length;
    const again = await scheduleRoute.GET(withTag(etag), ctx({ boardId: board.id }));
    expect(again.status).toBe(304);
    expect(again.headers.get('etag')).toBe(etag);
    expect(await again.text()).toBe('');
    // Another tag, or one of several, is answered as it should be
    expect((await scheduleRoute.GET(withTag('"something-else"'), ctx({ boardId: board.id }))).status).toBe(200);
    expect((await scheduleRoute.GET(withTag(`"x", ${etag}`), ctx({ boardId: board.id }))).status).toBe(304);
    // The label strips have their own tag
    const strips = await download(labelsRoute, board.id);
    expect(strips.res.headers.get('etag')).not.toBe(etag);
    expect((await labelsRoute.GET(withTag(etag), ctx({ boardId: board.id }))).status).toBe(200);

    // A label checked on the walk: the old tag no longer matches, the new file comes whole
    const wayId = (await getScheduleSource(installer(), board.id)).snapshot.ways.find((w) => w.circuit)!.id;
    const res = await labelRoute.POST(jsonRequest('POST', { status: 'matches' }), ctx({ boardId: board.id, wayId }));
    expect(res.status).toBe(200);
    const walked = await scheduleRoute.GET(withTag(etag), ctx({ boardId: board.id }));
    expect(walked.status).toBe(200);
    expect(walked.headers.get('etag')).not.toBe(etag);
    expect(renders.mock.calls.length).toBe(start + 2);
  });

  it('is never a 304 for a draft (no ETag: it is rendered every time)', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    signInAs(team.users.designer);
    const first = await download(scheduleRoute, board.id);
    expect(first.res.headers.get('etag')).toBeNull();
    expect(first.res.headers.get('cache-control')).toBe('private, no-store');
    expect((await scheduleRoute.GET(withTag('*'), ctx({ boardId: board.id }))).status).toBe(200);
  });
});

describe('a draft', () => {
  it('is rendered on every print, in a worker thread of the print pool, and never stored', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    signInAs(team.users.designer);
    const start = renders.mock.calls.length;
    const done = pool.printPool().completed;
    const first = await download(scheduleRoute, board.id);
    const second = await download(scheduleRoute, board.id);
    expect(first.timing).toMatch(/^render;/);
    expect(second.timing).toMatch(/^render;/);
    expect(renders.mock.calls.length).toBe(start + 2);
    // Rendered by the pool's threads, not by this one
    expect(pool.printPool().completed).toBe(done + 2);
    expect(pool.printPool().threads.length).toBeGreaterThan(0);
    expect(pool.printPool().threads.every((t) => t.threadId !== threadId)).toBe(true);
    expect(await pdfText(first.bytes)).toContain('not an issued schedule');
    const labels = await download(labelsRoute, board.id);
    expect(labels.timing).toMatch(/^render;/);
    expect(renders.mock.calls.length).toBe(start + 3);
  });
});

describe('the print pool’s warm-up (instrumentation.ts at a server start)', () => {
  it("has a thread render the warm-up board's schedule and strips, in the pool, and logs how long it took", async () => {
    const log = vi.spyOn(console, 'log').mockImplementation(() => {});
    const failed = vi.spyOn(console, 'error');
    const done = pool.printPool().completed;
    await pool.warmPrintPool();
    expect(pool.printPool().completed).toBe(done + 1);
    expect(failed).not.toHaveBeenCalled();
    expect(log).toHaveBeenCalledWith(expect.stringMatching(/^print pool warmed in \d+ ms$/));
    log.mockRestore();
    failed.mockRestore();
  });

  it('one pool per process: a second copy of the module (another bundle) finds the same pool', async () => {
    const first = pool.printPool();
    vi.resetModules();
    const again = await vi.importActual<typeof import('@/features/schedule/print/print-pool')>(
      '@/features/schedule/print/print-pool',
    );
    expect(again.printPool()).toBe(first);
  });
});
