import 'server-only';

import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

import { Piscina } from 'piscina';

import { HttpError } from '@/lib/errors';

import type { PrintJob, RenderedPdf } from './print-job';

/**
 * The process's one print pool is kept on `globalThis` under this key: Next bundles the server's
 * startup hook (instrumentation.ts, which warms the pool) apart from the routes that print, and
 * each bundle has its own copy of this module; a pool per copy would be an idle thread each, a
 * cold pool for the routes, and more render threads than `printThreads` allows.
 */
const POOL = Symbol.for('boardwright.print-pool');
const holder = globalThis as { [POOL]?: Piscina<PrintJob, RenderedPdf> };

/**
 * The bundled worker file: PRINT_WORKER_FILE, else `print-worker.mjs` in the build folder
 * (`NEXT_DIST_DIR`, default `.next`), where scripts/build-workers.mjs writes it.
 */
export function printWorkerFile(): string {
  return (
    process.env.PRINT_WORKER_FILE ?? path.join(process.cwd(), process.env.NEXT_DIST_DIR || '.next', 'print-worker.mjs')
  );
}

/** A whole number from the environment, else the fallback. */
function envCount(name: string, fallback: number, min: number): number {
  const asked = Number(process.env[name]);
  return Number.isInteger(asked) && asked >= min ? asked : fallback;
}

/**
 * Threads: PRINT_THREADS, else one fewer than the cores (at least one), so that renders
 * never take every core from the thread answering requests (on 2 cores: one thread).
 */
export function printThreads(): number {
  return envCount('PRINT_THREADS', Math.max(1, os.availableParallelism() - 1), 1);
}

/**
 * Prints waiting for a thread at most: PRINT_QUEUE, else 8. A render takes about half a second
 * of CPU, so a print waits a few seconds at worst; beyond that the server answers 503 with
 * Retry-After (`PrintQueueFull`) rather than letting waits and memory grow without end.
 */
export function printQueueLimit(): number {
  return envCount('PRINT_QUEUE', 8, 0);
}

/** The print pool of this process, started on first use. */
export function printPool(): Piscina<PrintJob, RenderedPdf> {
  const running = holder[POOL];
  if (running) return running;
  const max = printThreads();
  const pool = new Piscina<PrintJob, RenderedPdf>({
    filename: pathToFileURL(printWorkerFile()).href,
    minThreads: 1,
    maxThreads: max,
    maxQueue: printQueueLimit(),
    // A thread that has loaded react-pdf and the fonts is kept a while for the next print
    idleTimeout: 60_000,
  });
  holder[POOL] = pool;
  return pool;
}

/** Stops the print pool's threads and forgets it: the next print starts a new one. */
export async function closePrintPool(): Promise<void> {
  const pool = holder[POOL];
  delete holder[POOL];
  await pool?.destroy();
}

/**
 * Starts the print pool and has its first thread render a small board and a site of it
 * (print-worker.ts `warmUp`); a production server does it as it starts (instrumentation.ts), so
 * that the first print after a server start does not wait seconds for the thread to load
 * react-pdf and the fonts: measured on the demo site's pack, 5.0 s cold against 1.7 to
 * 1.9 s warm. Errors are logged, never thrown: a failed warm-up leaves the pool as it would
 * have been.
 */
export async function warmPrintPool(): Promise<void> {
  try {
    // The pool is typed for prints; `warmUp` takes nothing and answers its time
    const warm = printPool() as unknown as Piscina<null, number>;
    const ms = await warm.run(null, { name: 'warmUp' });
    console.log(`print pool warmed in ${Math.round(ms)} ms`);
  } catch (err) {
    console.error('print pool warm-up failed:', err);
  }
}

/** Seconds a refused print is asked to wait before trying again. */
const RETRY_AFTER_S = 5;

/** The print queue is full: 503 with Retry-After and a message a reader can act on. */
export class PrintQueueFull extends HttpError {
  constructor() {
    super(503, `The server is busy printing other schedules. Try again in ${RETRY_AFTER_S} seconds.`, {
      retryAfter: RETRY_AFTER_S,
    });
  }
}

/**
 * Whether a new print would be refused now: every thread busy and the queue at its limit.
 * Checked before a draft's source is gathered, so that a refused print costs next to nothing.
 */
export function printQueueFull(): boolean {
  const pool = holder[POOL];
  return pool !== undefined && pool.queueSize > 0 && pool.queueSize >= printQueueLimit();
}

/** Renders a PDF in a worker thread of the print pool; a full queue is `PrintQueueFull` (503). */
export async function renderInPool(job: PrintJob): Promise<RenderedPdf> {
  let out: RenderedPdf;
  try {
    out = await printPool().run(job);
  } catch (err) {
    // piscina's refusals: the queue at its limit, or no queue and every thread busy
    if (err instanceof Error && /queue is at limit|no task queue available/i.test(err.message)) {
      throw new PrintQueueFull();
    }
    throw err;
  }
  // A Uint8Array cloned from the worker arrives as one
  return { pdf: new Uint8Array(out.pdf.buffer, out.pdf.byteOffset, out.pdf.byteLength), fileName: out.fileName };
}
