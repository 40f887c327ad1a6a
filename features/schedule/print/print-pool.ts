import 'server-only';

import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

import { Piscina } from 'piscina';

import type { PrintJob, RenderedPdf } from './print-job';

let pool: Piscina<PrintJob, RenderedPdf> | undefined;

/**
 * The bundled worker file: PRINT_WORKER_FILE, else `print-worker.mjs` in the build folder
 * (`NEXT_DIST_DIR`, default `.next`), where scripts/build-print-worker.mjs writes it.
 */
export function printWorkerFile(): string {
  return (
    process.env.PRINT_WORKER_FILE ?? path.join(process.cwd(), process.env.NEXT_DIST_DIR || '.next', 'print-worker.mjs')
  );
}

/**
 * Threads: PRINT_THREADS, else one fewer than the cores (at least one), so that renders
 * never take every core from the threads answering requests.
 */
function threads(): number {
  const asked = Number(process.env.PRINT_THREADS);
  if (Number.isInteger(asked) && asked > 0) return asked;
  return Math.max(1, os.availableParallelism() - 1);
}

/** The print pool of this process, started on first use. */
export function printPool(): Piscina<PrintJob, RenderedPdf> {
  if (pool) return pool;
  const max = threads();
  pool = new Piscina<PrintJob, RenderedPdf>({
    filename: pathToFileURL(printWorkerFile()).href,
    minThreads: 1,
    maxThreads: max,
    // A thread that has loaded react-pdf and the fonts is kept a while for the next print
    idleTimeout: 60_000,
  });
  return pool;
}

/** Renders a PDF in a worker thread of the print pool. */
export async function renderInPool(job: PrintJob): Promise<RenderedPdf> {
  const out = await printPool().run(job);
  // A Uint8Array cloned from the worker arrives as one
  return { pdf: new Uint8Array(out.pdf.buffer, out.pdf.byteOffset, out.pdf.byteLength), fileName: out.fileName };
}
