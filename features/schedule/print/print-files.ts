import 'server-only';

import crypto from 'node:crypto';

import { LRUCache } from 'lru-cache';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { issuedPrintFacts, type IssuedPrintFacts } from '@/lib/dal/print-facts';
import { getScheduleSource, type ScheduleSource } from '@/lib/dal/schedule-source';
import { getObjectBytes, putObject, StorageUnavailable } from '@/lib/storage/s3';
import type { SiteResult } from '@/lib/supply';

import { formatDate } from '../utils/build-schedule';
import { parsePrintQuery } from '../utils/print-query';
import type { BoardPrintJob, PrintJob, RenderedPdf } from './print-job';
import { printQueueFull, PrintQueueFull, renderInPool } from './print-pool';

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
  /** An issued revision's file: its strong ETag (from the storage key, which names its content). */
  etag?: string;
};

const slug = (name: string) =>
  name
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .toLowerCase() || 'board';

/** The file name a render gives a board state (the same rule as build-schedule and build-labels). */
function fileNameOf(kind: BoardPrintJob['kind'], name: string, revision: number, frozen: boolean): string {
  return `${kind}-${slug(name)}-rev${revision}${frozen ? '' : '-draft'}.pdf`;
}

/** What a stored print's key is made from: the fields of a source (or of `IssuedPrintFacts`) it hashes. */
type KeyFacts = Pick<ScheduleSource, 'boardId' | 'boardUrl' | 'revision' | 'status' | 'issued' | 'labels'>;

/** A strong ETag for a stored file: its key names its content (rendered once per key). */
const etagOf = (key: string) => `"${crypto.createHash('sha256').update(key).digest('base64url').slice(0, 27)}"`;

/**
 * The layout of the printed documents: raise it with any change to what a schedule or label strip
 * prints or how (a fix in the PDF's wording, figures or layout), so that the files stored for
 * issued revisions are rendered again with it instead of being served as they were. 2: the carried
 * volt drop limit to two decimals, "Vd used above", "(continued)" once. 3: long names fitted to
 * the header and footer (utils/fit-header.ts). 4: a label's text fitted between its number and its
 * device (`fitLabelTexts`), the shortened ones listed whole under the strips.
 */
export const PRINT_LAYOUT = 4;

/**
 * Where an issued revision's PDF is stored. The revision itself never changes (its row cannot be
 * updated), but its schedule also prints what can: the label walk's results and notes, the
 * board's stage (issued, labels matched), the issuer's name as read now and the day it is
 * printed. Those go into a hash in the key, so a label change gives a new file; within one day
 * and one state of the walk the schedule is rendered once. Label strips print none of them.
 * Both keys name the print layout (`PRINT_LAYOUT`).
 */
export function storedKey(kind: BoardPrintJob['kind'], source: KeyFacts, now: Date, layout = PRINT_LAYOUT): string {
  const base = `prints/${source.boardId}/rev-${source.revision}`;
  if (kind === 'labels') return `${base}/labels-v${layout}.pdf`;
  const labels = Object.entries(source.labels ?? {}).sort(([a], [b]) => a.localeCompare(b));
  const state = JSON.stringify([
    source.status,
    source.issued,
    labels,
    formatDate(now.toISOString()),
    source.boardUrl,
    layout,
  ]);
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
export async function printPdf(
  kind: BoardPrintJob['kind'],
  source: ScheduleSource,
  now = new Date(),
): Promise<PrintedPdf> {
  const fileName = fileNameOf(kind, source.snapshot.settings.name, source.revision, source.frozen);
  const job = { kind, source, now: now.toISOString() };
  if (!source.frozen) return rendered(await timed(job), fileName);
  const key = storedKey(kind, source, now);
  const etag = etagOf(key);
  const found = await storedFile(key);
  if (found) return { body: found, length: found.byteLength, fileName, made: 'stored', renderMs: 0, etag };
  // Requests for a file not yet stored wait for the one render of it under way in this process
  let pending = storing.get(key);
  if (!pending) {
    pending = timed(job)
      .then(async (out) => {
        // The file is a render of a fixed record (the revision's snapshot is in the database):
        // with the storage away it is answered all the same, and stored by a later print
        await putObject(key, out.pdf, 'application/pdf').then(
          () => keepFile(key, out.pdf),
          (err: unknown) => unlessStorageAway(err, 'not stored'),
        );
        return out;
      })
      .finally(() => storing.delete(key));
    storing.set(key, pending);
  }
  return { ...rendered(await pending, fileName), etag };
}

/**
 * An issued revision's print answered from its facts alone (one light statement, no snapshot
 * or sizing read): 304 when the caller's `If-None-Match` names the file's ETag, else the stored
 * file streamed from object storage. Null when it is not stored yet (the caller then gathers
 * the source and renders it through `printPdf`, which stores it).
 */
export async function storedPrintResponse(
  kind: BoardPrintJob['kind'],
  facts: IssuedPrintFacts,
  req: Request,
  download: boolean,
  now = new Date(),
): Promise<Response | null> {
  const key = storedKey(kind, facts, now);
  const etag = etagOf(key);
  const fileName = fileNameOf(kind, facts.name, facts.revision, true);
  if (matches(req.headers.get('if-none-match'), etag)) {
    return new Response(null, { status: 304, headers: { ETag: etag, 'Cache-Control': CACHE_ISSUED } });
  }
  const found = await storedFile(key);
  if (!found) return null;
  return pdfResponse({ body: found, length: found.byteLength, fileName, made: 'stored', renderMs: 0, etag }, download);
}

/** Whether an If-None-Match header names this ETag (a list, `*`, or weak forms of it). */
function matches(header: string | null, etag: string): boolean {
  if (!header) return false;
  return header.split(',').some((t) => {
    const tag = t.trim();
    return tag === '*' || tag === etag || tag === `W/${etag}`;
  });
}

/**
 * An issued file may be kept by the caller's browser but never by a shared cache, and is
 * checked again on each use (a label change on the walk gives a new file): with its ETag that
 * check is a 304 when nothing changed.
 */
const CACHE_ISSUED = 'private, no-cache';

/**
 * Issued files this process read or stored lately, by storage key, at most PRINT_FILE_CACHE_MB
 * (default 32) megabytes of them. A key names its content (a file is rendered once per key and
 * never rewritten), so a copy kept here cannot go stale; every request still reads the print's
 * facts, and so who may see it, from the database. It spares object storage a round trip for
 * the same file printed again (the walk, a second download): measured in npm run bench:pages.
 */
const FILE_CACHE_BYTES = Math.max(0, Number(process.env.PRINT_FILE_CACHE_MB ?? 32)) * 1024 * 1024;
const files = FILE_CACHE_BYTES
  ? new LRUCache<string, Uint8Array>({
      maxSize: FILE_CACHE_BYTES,
      sizeCalculation: (pdf) => Math.max(1, pdf.byteLength),
    })
  : null;

function keepFile(key: string, pdf: Uint8Array): void {
  if (files && pdf.byteLength <= FILE_CACHE_BYTES / 8) files.set(key, pdf);
}

/** A stored issued file's bytes (kept here, else read from object storage), or null when not stored. */
async function storedFile(key: string): Promise<Uint8Array | null> {
  const kept = files?.get(key);
  if (kept) return kept;
  // With the storage away, a file not kept here is rendered again from its record
  const bytes = await getObjectBytes(key).catch((err: unknown) => unlessStorageAway(err, 'rendered instead'));
  if (bytes) keepFile(key, bytes);
  return bytes;
}

/** Logs a storage that is away (the print goes on without it: null); rethrows anything else. */
function unlessStorageAway(err: unknown, what: string): null {
  if (!(err instanceof StorageUnavailable)) throw err;
  console.warn(`[print] file storage is not reachable: an issued file ${what}`);
  return null;
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

/**
 * The site pack's own pages (the diagram and the values carried to each board), rendered off
 * the request's event loop like every print: on the request's thread they held up every other
 * request of the process for a few hundred milliseconds a pack, and the first pack after a start
 * for seconds while react-pdf loaded there.
 */
export async function printSitePackPages(site: SiteResult, siteName: string, now = new Date()): Promise<RenderedPdf> {
  return render({ kind: 'site-pack', site, siteName, now: now.toISOString() });
}

/** The PDF's bytes (for an e-mail attachment). */
export async function printPdfBytes(kind: BoardPrintJob['kind'], source: ScheduleSource): Promise<RenderedPdf> {
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
    'Cache-Control': printed.etag ? CACHE_ISSUED : 'private, no-store',
    'Server-Timing':
      printed.made === 'stored'
        ? 'stored;desc="from storage"'
        : `render;desc="rendered";dur=${printed.renderMs.toFixed(1)}`,
  };
  if (printed.length !== undefined) headers['Content-Length'] = String(printed.length);
  if (printed.etag) headers.ETag = printed.etag;
  return new Response(printed.body as BodyInit, { headers });
}

/**
 * The answer to a refused print (`PrintQueueFull`): 503 with Retry-After. A browser that opened
 * the PDF link itself (it accepts HTML) gets a short page saying so instead of JSON.
 */
export function printBusyResponse(err: PrintQueueFull, req: Request): Response {
  const retry = String(err.body.retryAfter);
  if (!(req.headers.get('accept') ?? '').includes('text/html')) {
    return Response.json({ error: err.message }, { status: 503, headers: { 'Retry-After': retry } });
  }
  const page = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Busy printing</title>
<meta name="viewport" content="width=device-width, initial-scale=1"></head>
<body style="font-family: system-ui, sans-serif; margin: 2rem; max-width: 40rem; color: #1f2328">
<h1 style="font-size: 1.25rem">Busy printing</h1><p>${err.message}</p>
<p><a href="javascript:location.reload()">Try again</a></p></body></html>`;
  return new Response(page, {
    status: 503,
    headers: { 'Content-Type': 'text/html; charset=utf-8', 'Retry-After': retry, 'Cache-Control': 'no-store' },
  });
}

/**
 * A schedule or label strips request: an issued revision's stored file from one light
 * statement (or 304), else the board state gathered and printed (`printPdf`). A draft is
 * refused with 503 before its source is gathered when the print queue is full.
 */
export async function answerPrint(
  kind: BoardPrintJob['kind'],
  { req, actor, boardId }: { req: Request; actor: Actor; boardId: string },
): Promise<Response> {
  const query = parsePrintQuery(req.url);
  const download = query.download === '1';
  try {
    const facts = await issuedPrintFacts(actor, boardId, query.revision);
    if (facts) {
      const stored = await storedPrintResponse(kind, facts, req, download);
      if (stored) return stored;
    } else if (printQueueFull() && can(actor.role, 'schedule.print-draft')) {
      throw new PrintQueueFull();
    }
    // The board state to print (ownership and the installers' rule in the DAL)
    const source = await getScheduleSource(actor, boardId, query.revision);
    return pdfResponse(await printPdf(kind, source), download);
  } catch (err) {
    if (err instanceof PrintQueueFull) return printBusyResponse(err, req);
    throw err;
  }
}
