import 'server-only';

import pMap from 'p-map';

import { printPdfBytes } from '@/features/schedule/print/print-files';
import { printThreads } from '@/features/schedule/print/print-pool';
import { renderSitePackPdf } from '@/features/site-pack/render-site-pack';
import type { Actor } from '@/lib/auth/session';
import { getScheduleSource } from '@/lib/dal/schedule-source';
import { sitePackData } from '@/lib/dal/site-supply';
import { conflict } from '@/lib/errors';
import { joinPdfs } from '@/lib/pdf/join-pdfs';

/**
 * The site pack as one PDF: the site pack feature's pages (the diagram and the values carried
 * to each board), then each board's schedule from the schedule feature (the stored file of an
 * issued revision, else the live draft rendered in the print pool), joined with pdf-lib. Both
 * features are composed here, in the app layer, since features do not import each other.
 * The schedules go to the pool as many at a time as it has threads: all at once, a site of more
 * boards than the pool's queue holds (8) was refused as "busy" however quiet the server was.
 */
export async function composeSitePack(
  actor: Actor,
  siteId: string,
): Promise<{ pdf: Uint8Array; fileName: string; siteName: string; boardCount: number }> {
  const data = await sitePackData(actor, siteId);
  if (!data.boardIds.length) throw conflict('This site has no boards to print yet.');
  // The schedules render in the print pool while the pack's own pages render here
  const [own, schedules] = await Promise.all([
    renderSitePackPdf(data.site, data.siteName),
    pMap(
      data.boardIds,
      async (boardId) => (await printPdfBytes('schedule', await getScheduleSource(actor, boardId))).pdf,
      { concurrency: printThreads() },
    ),
  ]);
  const pdf = await joinPdfs([own.pdf, ...schedules], `Site pack: ${data.siteName}`);
  return { pdf, fileName: own.fileName, siteName: data.siteName, boardCount: data.boardIds.length };
}
