/**
 * The print worker: renders one schedule or label strips PDF in a worker thread of the print
 * pool (print-pool.ts), so that a render's CPU never holds up the server's own event loop.
 * Bundled into `<distDir>/print-worker.mjs` by scripts/build-workers.mjs after `next build`.
 */
import os from 'node:os';
import { isMainThread } from 'node:worker_threads';

import { renderLabelStripsPdf, renderSchedulePdf } from '../render-schedule';
import { renderSitePackPdf } from '../site-pack/render-site-pack';

import type { PrintJob, RenderedPdf } from './print-job';
import { warmUpSite, warmUpSource } from './warm-up';

/**
 * A render thread runs at a lower priority (PRINT_NICE, default 10) than the thread answering
 * requests: on Linux a thread's nice value is its own (`setpriority` with 0 names the calling
 * thread), so the server's event loop keeps the CPU it needs while prints take what is left.
 * Never in the main thread (the in-process render of `next dev` and tests).
 */
if (!isMainThread) {
  const nice = Number(process.env.PRINT_NICE ?? 10);
  try {
    if (Number.isInteger(nice) && nice > 0) os.setPriority(Math.min(nice, 19));
  } catch {
    // Not allowed here (some containers): renders run at the normal priority
  }
}

export default async function render(job: PrintJob): Promise<RenderedPdf> {
  if (job.kind === 'site-pack') return renderSitePackPdf(job.site, job.siteName, new Date(job.now));
  return job.kind === 'labels' ? renderLabelStripsPdf(job.source) : renderSchedulePdf(job.source, new Date(job.now));
}

/**
 * Renders the warm-up board's schedule, label strips and site pack pages and throws them away
 * (print-pool.ts `warmPrintPool`); answers how long it took, in milliseconds.
 */
export async function warmUp(): Promise<number> {
  const started = performance.now();
  const source = warmUpSource();
  await renderSchedulePdf(source, new Date());
  await renderLabelStripsPdf(source);
  await renderSitePackPdf(warmUpSite(source), source.snapshot.siteName, new Date());
  return performance.now() - started;
}
