import 'server-only';

import pMap from 'p-map';

import { printPdfBytes, printSitePackPages } from '@/features/schedule/print/print-files';
import { printThreads } from '@/features/schedule/print/print-pool';
import type { Actor } from '@/lib/auth/session';
import { getScheduleSource } from '@/lib/dal/schedule-source';
import { sitePackData } from '@/lib/dal/site-supply';
import { conflict } from '@/lib/errors';
import { joinPdfs } from '@/lib/pdf/join-pdfs';

/**
 * The site pack as one PDF: its own pages (the diagram and the values carried to each board,
 * rendered in the print pool), then each board's schedule (the stored file of an issued
 * revision, else the live draft rendered in the print pool), joined with pdf-lib.
 * The schedules go to the pool as many at a time as it has threads: all at once, a site of more
 * boards than the pool's queue holds (8) was refused as "busy" however quiet the server was.
 */
export async function composeSitePack(
  actor: Actor,
  siteId: string,
): Promise<{ pdf: Uint8Array; fileName: string; siteName: string; boardCount: number }> {
  const data = await sitePackData(actor, siteId);
  if (!data.boardIds.length) throw conflict('This site has no boards to print yet.');
  // Everything renders in the print pool: the pack's own pages and the schedules
  const [own, schedules] = await Promise.all([
    printSitePackPages(data.site, data.siteName),
    pMap(
      data.boardIds,
      async (boardId) => (await printPdfBytes('schedule', await getScheduleSource(actor, boardId))).pdf,
      { concurrency: printThreads() },
    ),
  ]);
  const pdf = await joinPdfs([own.pdf, ...schedules], `Site pack: ${data.siteName}`);
  return { pdf, fileName: own.fileName, siteName: data.siteName, boardCount: data.boardIds.length };
}
