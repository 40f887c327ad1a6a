/**
 * The print pool's queue is bounded: with one thread and one place in the queue, drafts printed
 * all at once are partly refused with 503 and Retry-After (JSON for the app's own calls, a short
 * page for a browser that opened the PDF link), and the stored file of an issued revision is
 * still served. The worker is bundled as in schedule-files.test.ts.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as packRoute from '@/app/api/sites/[siteId]/pack/route';
import * as pool from '@/features/schedule/print/print-pool';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
const workerFile = path.join(process.cwd(), '.data', `print-worker-queue-${crypto.randomUUID().slice(0, 8)}.mjs`);
const saved = { threads: process.env.PRINT_THREADS, queue: process.env.PRINT_QUEUE };

beforeAll(async () => {
  const { buildPrintWorker } = (await import(path.join(process.cwd(), 'scripts/build-workers.mjs'))) as {
    buildPrintWorker: (out: string) => Promise<string>;
  };
  await buildPrintWorker(workerFile);
  process.env.PRINT_WORKER_FILE = workerFile;
  process.env.PRINT_THREADS = '1';
  process.env.PRINT_QUEUE = '1';
  team = await makeOrganisation('Print queue');
}, 60_000);

afterAll(async () => {
  await pool.closePrintPool();
  fs.rmSync(workerFile, { force: true });
  for (const [name, value] of [
    ['PRINT_THREADS', saved.threads],
    ['PRINT_QUEUE', saved.queue],
  ] as const) {
    if (value === undefined) delete process.env[name];
    else process.env[name] = value;
  }
});

const print = (boardId: string, accept = 'application/json') =>
  scheduleRoute.GET(new Request('http://127.0.0.1/x', { headers: { accept } }), ctx({ boardId }));

describe('the print queue', () => {
  it('refuses drafts beyond its limit with 503 and Retry-After, and prints the rest', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    signInAs(team.users.designer);
    expect(pool.printQueueLimit()).toBe(1);
    const answers = await Promise.all(Array.from({ length: 6 }, () => print(board.id)));
    const statuses = answers.map((a) => a.status);
    expect(statuses.filter((s) => s === 200).length).toBeGreaterThanOrEqual(1);
    const refused = answers.filter((a) => a.status === 503);
    expect(refused.length).toBeGreaterThanOrEqual(1);
    expect(statuses.every((s) => s === 200 || s === 503)).toBe(true);
    for (const r of refused) {
      expect(r.headers.get('retry-after')).toBe('5');
      expect(((await r.json()) as { error: string }).error).toMatch(/busy printing other schedules.*try again/i);
    }
    for (const a of answers.filter((x) => x.status === 200)) {
      expect(a.headers.get('content-type')).toBe('application/pdf');
      await a.arrayBuffer();
    }
  }, 60_000);

  it('answers a browser that opened the PDF link with a page saying so', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    signInAs(team.users.designer);
    const answers = await Promise.all(Array.from({ length: 6 }, () => print(board.id, 'text/html,*/*')));
    const refused = answers.find((a) => a.status === 503);
    expect(refused).toBeDefined();
    expect(refused!.headers.get('content-type')).toMatch(/^text\/html/);
    expect(refused!.headers.get('retry-after')).toBe('5');
    expect(await refused!.text()).toContain('busy printing other schedules');
    await Promise.all(answers.filter((a) => !a.bodyUsed).map((a) => a.arrayBuffer()));
  }, 60_000);

  it('still serves an issued revision once it is stored, whatever the queue holds', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    await board.update({ status: 'in-review' });
    signInAs(team.users.inspector);
    const approve = await approveRoute.POST(
      jsonRequest('POST', { declaration: team.users.inspector.name }),
      ctx({ boardId: board.id }),
    );
    expect(approve.status).toBe(200);
    expect((await print(board.id)).status).toBe(200);
    const { board: draft } = await makeBoard(team.org.id, 'workshop');
    signInAs(team.users.designer);
    const drafts = Array.from({ length: 4 }, () => print(draft.id));
    const issued = await print(board.id);
    expect(issued.status).toBe(200);
    expect(issued.headers.get('server-timing')).toMatch(/^stored;/);
    await Promise.all((await Promise.all(drafts)).map((a) => a.arrayBuffer()));
  }, 60_000);

  it('prints a site pack of more draft boards than the queue holds, one schedule per board', async () => {
    // Four boards on one site, every one a draft: with one thread and one place in the queue,
    // the pack's four schedules sent to the pool at once were three too many (503)
    const { site, board: first } = await makeBoard(team.org.id, 'workshop');
    const boards = [first];
    for (let i = 0; i < 3; i++) {
      const { board } = await makeBoard(team.org.id, 'flat');
      await board.update({ siteId: site.id });
      boards.push(board);
    }
    signInAs(team.users.inspector);
    const done = pool.printPool().completed;
    const res = await packRoute.GET(jsonRequest('GET'), ctx({ siteId: site.id }));
    expect(res.status).toBe(200);
    const pack = await PDFDocument.load(await res.arrayBuffer());
    // Every page rendered in the pool's thread, the pack's own pages too: four schedules and one
    // render of the diagram and carried values, none on the thread answering requests
    expect(pool.printPool().completed).toBe(done + boards.length + 1);
    // The pack holds its own pages and every board's schedule, each as many pages as printed alone
    let schedulePages = 0;
    for (const b of boards) {
      const alone = await print(b.id);
      expect(alone.status).toBe(200);
      schedulePages += (await PDFDocument.load(await alone.arrayBuffer())).getPageCount();
    }
    expect(pack.getPageCount()).toBeGreaterThan(schedulePages);
  }, 90_000);
});
