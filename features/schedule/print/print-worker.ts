/**
 * The print worker: renders one schedule or label strips PDF in a worker thread of the print
 * pool (print-pool.ts), so that a render's CPU never holds up the server's own event loop.
 * Bundled into `<distDir>/print-worker.mjs` by scripts/build-print-worker.mjs after `next build`.
 */
import { renderLabelStripsPdf, renderSchedulePdf } from '../render-schedule';

import type { PrintJob, RenderedPdf } from './print-job';

export default async function render(job: PrintJob): Promise<RenderedPdf> {
  return job.kind === 'labels' ? renderLabelStripsPdf(job.source) : renderSchedulePdf(job.source, new Date(job.now));
}
