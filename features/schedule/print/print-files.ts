import 'server-only';

import crypto from 'node:crypto';

import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { getObjectStream, putObject } from '@/lib/storage/s3';

import { formatDate } from '../utils/build-schedule';
import type { PrintJob, RenderedPdf } from './print-job';
import { renderInPool } from './print-pool';

/**
 * A printed PDF ready to answer: the stored file's stream, or freshly rendered bytes, and how
 * it was made (`stored`: read from object storage; `rendered`: rendered now).
 */
export type PrintedPdf = {
  body: ReadableStream<Uint8Array> | Uint8Array;
  length: number | undefined;
  fileName: string;
  made: 'stored' | 'rendered';
  renderMs: number;
};

const slug = (name: string) =>
  name
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .toLowerCase() || 'board';

/** The file name a render gives a board state (the same rule as build-schedule and build-labels). */
function fileNameOf(kind: PrintJob['kind'], source: ScheduleSource): string {
  return `${kind}-${slug(source.snapshot.settings.name)}-rev${source.revision}${source.frozen ? '' : '-draft'}.pdf`;
}

/**
 * Where an issued revision's PDF is stored. The revision itself never changes (its row cannot be
 * updated), but its schedule also prints what can: the label walk's results and notes, the
 * board's stage (issued, labels matched), the issuer's name as read now and the day it is
 * printed. Those go into a hash in the key, so a label change gives a new file; within one day
 * and one state of the walk the schedule is rendered once. Label strips print none of them.
 */
export function storedKey(kind: PrintJob['kind'], source: ScheduleSource, now: Date): string {
  const base = `prints/${source.boardId}/rev-${source.revision}`;
  if (kind === 'labels') return `${base}/labels.pdf`;
  const labels = Object.entries(source.labels ?? {}).sort(([a], [b]) => a.localeCompare(b));
  const state = JSON.stringify([source.status, source.issued, labels, formatDate(now.toISOString()), source.boardUrl]);
  const hash = crypto.createHash('sha256').update(state).digest('hex').slice(0, 24);
  return `${base}/schedule-${hash}.pdf`;
}

/**
 * Renders off the request's event loop: in the print pool's worker threads. Outside production
 * (`next dev`, tests) only when PRINT_WORKER_FILE names a bundled worker, else in this process:
 * a worker left in the build folder by an older build must never render for the code under test.
 */
async function render(job: PrintJob): Promise<RenderedPdf> {
  if (process.env.NODE_ENV !== 'production' && !process.env.PRINT_WORKER_FILE) {
    const { default: renderHere } = await import('./print-worker');
    return renderHere(job);
  }
  return renderInPool(job);
}

/**
 * The PDF of a board state. An issued revision's is read from object storage when it is
 * there, else rendered (in the pool) and stored; a draft's is always rendered in the pool.
 */
export async function printPdf(kind: PrintJob['kind'], source: ScheduleSource, now = new Date()): Promise<PrintedPdf> {
  const fileName = fileNameOf(kind, source);
  const job = { kind, source, now: now.toISOString() };
  if (!source.frozen) return rendered(await timed(job), fileName);
  const key = storedKey(kind, source, now);
  const found = await getObjectStream(key);
  if (found) return { body: found.body, length: found.length, fileName, made: 'stored', renderMs: 0 };
  // Requests for a file not yet stored wait for the one render of it under way in this process
  let pending = storing.get(key);
  if (!pending) {
    pending = timed(job)
      .then(async (out) => {
        await putObject(key, out.pdf, 'application/pdf');
        return out;
      })
      .finally(() => storing.delete(key));
    storing.set(key, pending);
  }
  return rendered(await pending, fileName);
}

/** Renders of issued files under way in this process, by storage key (removed when stored). */
const storing = new Map<string, Promise<RenderedPdf & { renderMs: number }>>();

async function timed(job: PrintJob): Promise<RenderedPdf & { renderMs: number }> {
  const started = performance.now();
  const out = await render(job);
  return { ...out, renderMs: performance.now() - started };
}

function rendered(out: RenderedPdf & { renderMs: number }, fileName: string): PrintedPdf {
  return { body: out.pdf, length: out.pdf.byteLength, fileName, made: 'rendered', renderMs: out.renderMs };
}

/** The PDF's bytes (for an e-mail attachment). */
export async function printPdfBytes(kind: PrintJob['kind'], source: ScheduleSource): Promise<RenderedPdf> {
  const printed = await printPdf(kind, source);
  const pdf =
    printed.body instanceof Uint8Array ? printed.body : new Uint8Array(await new Response(printed.body).arrayBuffer());
  return { pdf, fileName: printed.fileName };
}

/** The answer to a PDF request, with how it was made in `Server-Timing`. */
export function pdfResponse(printed: PrintedPdf, download: boolean): Response {
  const headers: Record<string, string> = {
    'Content-Type': 'application/pdf',
    'Content-Disposition': `${download ? 'attachment' : 'inline'}; filename="${printed.fileName}"`,
    'Cache-Control': 'private, no-store',
    'Server-Timing':
      printed.made === 'stored'
        ? 'stored;desc="from storage"'
        : `render;desc="rendered";dur=${printed.renderMs.toFixed(1)}`,
  };
  if (printed.length !== undefined) headers['Content-Length'] = String(printed.length);
  return new Response(printed.body as BodyInit, { headers });
}
