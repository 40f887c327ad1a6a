import zlib from 'node:zlib';

import { PDFArray, PDFDict, PDFDocument, PDFName, type PDFRawStream, type PDFRef } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { warmUpSite, warmUpSource } from '@/features/schedule/print/warm-up';
import { renderLabelStripsPdf, renderSchedulePdf } from '@/features/schedule/render-schedule';
import { renderSitePackPdf } from '@/features/schedule/site-pack/render-site-pack';
import { registerPrintFonts } from '@/features/schedule/utils/fonts';
import { installPdfkitFontReuse, pdfkitFontReuses, uninstallPdfkitFontReuse } from '@/lib/pdf/pdfkit-font-reuse';

/** A font's PostScript name without its subset tag (pdfkit derives the tag from the font's number). */
const fontName = (font: PDFDict) => String(font.get(PDFName.of('BaseFont'))).replace(/^\/[A-Z]{6}\+/, '/');

/**
 * What a PDF draws, page by page: each page's content streams inflated, with pdfkit's font
 * resource names (/F1, /F7: numbered in the order fonts were opened, so they differ when a font
 * is not opened again) replaced by the name of the font each stands for.
 */
async function drawing(pdf: Uint8Array): Promise<string[]> {
  const doc = await PDFDocument.load(pdf);
  return doc.getPages().map((page) => {
    const resources = page.node.Resources()?.lookup(PDFName.of('Font'), PDFDict);
    const names = new Map(
      (resources?.entries() ?? []).map(([name, ref]) => [name.asString(), fontName(doc.context.lookup(ref, PDFDict))]),
    );
    const contents = page.node.get(PDFName.of('Contents'));
    const refs = contents instanceof PDFArray ? contents.asArray() : [contents];
    return refs
      .map((ref) => zlib.inflateSync((doc.context.lookup(ref as PDFRef) as PDFRawStream).contents).toString('latin1'))
      .join('\n')
      .replace(/\/F\d+(?= )/g, (name) => names.get(name) ?? `${name} (not in the page's fonts)`);
  });
}

const NOW = new Date('2026-12-03T08:00:00Z');

describe('selecting a font pdfkit has opened already (lib/pdf/pdfkit-font-reuse.ts)', () => {
  // Registering the fonts installs it (once a process): done first, so that the test decides
  beforeAll(() => registerPrintFonts());
  afterAll(() => installPdfkitFontReuse());

  it('draws the schedule, the label strips and the site pack pages exactly as pdfkit alone does, without opening the fonts again', async () => {
    const source = warmUpSource();
    const renders = [
      () => renderSchedulePdf(source, NOW),
      () => renderLabelStripsPdf(source),
      () => renderSitePackPdf(warmUpSite(source), 'Warm-up', NOW),
    ];
    for (const render of renders) {
      uninstallPdfkitFontReuse();
      const before = pdfkitFontReuses();
      const alone = await render();
      // pdfkit's own font() was the one called
      expect(pdfkitFontReuses()).toBe(before);
      installPdfkitFontReuse();
      const reusing = await render();
      // react-pdf selected fonts through the shim, and most selections were answered by it
      expect(pdfkitFontReuses() - before).toBeGreaterThan(10);
      const [a, b] = [await drawing(alone.pdf), await drawing(reusing.pdf)];
      expect(b.length).toBeGreaterThan(0);
      expect(b.join()).toContain('DejaVuSansCondensed-Bold');
      expect(b).toEqual(a);
    }
  }, 60_000);
});
