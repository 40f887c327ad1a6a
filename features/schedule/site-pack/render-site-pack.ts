import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { createElement, type ReactElement } from 'react';

import { SIZING_CAUTION } from '@/lib/sizing';
import type { SiteResult } from '@/lib/supply';

import { DIAGRAM } from '@/components/site-diagram/layout';

import { SitePackDocument } from './components/site-pack-document';
import { shortenToFit } from '../utils/fit-header';
import { printFontMeasure, type TextMeasure } from '../utils/fonts';

export type RenderedSitePack = { pdf: Uint8Array; fileName: string };

/** "Hollin Lane Joinery" → "site-pack-hollin-lane-joinery.pdf". */
export function sitePackFileName(siteName: string): string {
  const slug = siteName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return `site-pack-${slug || 'site'}.pdf`;
}

/** The board's name in the drawing: 12 pt bold in its box less 10 units each side. */
const NAME_BOX = { width: DIAGRAM.boxWidth - 20, lines: 1, size: 12, bold: true } as const;

/** Each board's name as its box in the drawing has room for (cut with an ellipsis), by board id. */
export function diagramBoxNames(site: SiteResult, measure: TextMeasure): Map<string, string> {
  return new Map(site.boards.map((b) => [b.boardId, shortenToFit(b.name, '', NAME_BOX, measure)]));
}

/**
 * The site pack's own pages as one PDF: the single-line diagram of the site, then the values
 * carried to each board with their working; the design-aid caution on every page. Pure apart
 * from reading the font files. The board schedules that follow in the pack are the schedule
 * feature's pages: composing them into the same document is left to the route (features do not
 * import each other).
 */
export async function renderSitePackPdf(
  site: SiteResult,
  siteName: string,
  now = new Date(),
): Promise<RenderedSitePack> {
  const measure = await printFontMeasure();
  const printedOn = now.toISOString().slice(0, 10);
  const element = createElement(SitePackDocument, {
    site,
    siteName,
    printedOn,
    caution: SIZING_CAUTION,
    boxNames: diagramBoxNames(site, measure),
  }) as unknown as ReactElement<DocumentProps>;
  const buffer = await renderToBuffer(element);
  return { pdf: new Uint8Array(buffer), fileName: sitePackFileName(siteName) };
}
