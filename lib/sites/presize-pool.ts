import 'server-only';

import path from 'node:path';
import { pathToFileURL } from 'node:url';

import { Piscina } from 'piscina';

import { treeBoardText } from '@/lib/dal/board-repository';

import { presizeTree, type PresizeAnswer, type PresizeTask } from './presize';
import type { PresizeJob } from './presize-worker';

/**
 * The process's one presize pool (one thread), kept on `globalThis` as the print pool is
 * (features/schedule/print/print-pool.ts): each bundle of the server has its own copy of this module.
 */
const POOL = Symbol.for('boardwright.presize-pool');
const holder = globalThis as { [POOL]?: Piscina<PresizeJob, PresizeAnswer> };

/** The bundled worker file: PRESIZE_WORKER_FILE, else `presize-worker.mjs` in the build folder. */
export function presizeWorkerFile(): string {
  return (
    process.env.PRESIZE_WORKER_FILE ??
    path.join(process.cwd(), process.env.NEXT_DIST_DIR || '.next', 'presize-worker.mjs')
  );
}

/**
 * One thread: a site's re-sizes run one ahead at a time (lib/dal/site-tree.ts
 * `presizeThenWrite`), and on two cores the other core is the database's. The thread keeps the
 * boards it parsed (presize-worker.ts), so it is kept, not let go when idle.
 */
function presizePool(): Piscina<PresizeJob, PresizeAnswer> {
  return (holder[POOL] ??= new Piscina<PresizeJob, PresizeAnswer>({
    filename: pathToFileURL(presizeWorkerFile()).href,
    minThreads: 1,
    maxThreads: 1,
    idleTimeout: Infinity,
  }));
}

/** Stops the presize pool's thread and forgets it: the next presize starts a new one. */
export async function closePresizePool(): Promise<void> {
  const pool = holder[POOL];
  delete holder[POOL];
  await pool?.destroy();
}

/**
 * `presizeTree` in the presize pool's thread on a production server (or wherever
 * PRESIZE_WORKER_FILE names a bundled worker), else in this process (`next dev`, tests).
 */
export async function runPresize(task: PresizeTask): Promise<PresizeAnswer> {
  if (process.env.NODE_ENV !== 'production' && !process.env.PRESIZE_WORKER_FILE) return presizeTree(task);
  return presizePool().run({
    siteId: task.siteId,
    origin: task.origin,
    boards: task.boards.map((b) => ({ id: b.id, text: treeBoardText(b) })),
  });
}
