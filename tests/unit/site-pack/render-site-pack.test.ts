import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';

import { layoutSite } from '@/components/site-diagram/layout';
import { diagramPages, pageDrawingHeight } from '@/features/schedule/site-pack/components/site-pack-document';
import { diagramBoxNames, renderSitePackPdf, sitePackFileName } from '@/features/schedule/site-pack/render-site-pack';
import { printFontMeasure } from '@/features/schedule/utils/fonts';
import { SIZING_CAUTION } from '@/lib/sizing';
import { sizeSite, type SiteBoardInput } from '@/lib/supply';

import { threeLevel } from '../supply/fixtures';

/** The text of each page of a PDF. */
async function pagesOf(bytes: Uint8Array): Promise<string[]> {
  const parser = new PDFParse({ data: bytes.slice() });
  try {
    const result = await parser.getText();
    return result.pages.map((p) => p.text.replace(/\s+/g, ' '));
  } finally {
    await parser.destroy();
  }
}

describe('renderSitePackPdf', () => {
  it('draws the diagram and the carried values with their working, the caution on every page', async () => {
    const site = sizeSite(threeLevel());
    const { pdf, fileName } = await renderSitePackPdf(site, 'Hollin Lane Joinery', new Date('2026-12-02T12:00:00Z'));
    expect(fileName).toBe('site-pack-hollin-lane-joinery.pdf');
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
    const pages = await pagesOf(pdf);
    expect(pages.length).toBeGreaterThanOrEqual(2);
    const caution = SIZING_CAUTION.replace(/\s+/g, ' ').slice(0, 60);
    for (const p of pages) expect(p.replace(/\s+/g, ' ')).toContain(caution.split(' ').slice(0, 6).join(' '));
    const all = pages.join(' ');
    expect(all).toContain('Site pack: Hollin Lane Joinery');
    expect(all).toContain('Machine shop board');
    // The hand-worked three-level values (tests/unit/supply/carried-values.test.ts).
    expect(all).toContain('Zdb 0.678 Ω');
    expect(all).toContain('1.09 kA');
    expect(all).toContain('MCB C20 (way 2L3), L3');
    expect(all).toContain('Selective up to 100 A');
    expect(all).toMatch(/Basis: Site-supply method \(carried values\), rule 1/);
  }, 60_000);

  it('cuts a board’s name to its box in the drawing, and prints it whole in the carried values', async () => {
    const t = threeLevel();
    const long = 'Finishing room sub-distribution board beside the spray booth extract fan isolator';
    t.boards = t.boards.map((b) => (b.id === 'fin' ? { ...b, name: long } : b));
    const site = sizeSite(t);
    const measure = await printFontMeasure();
    const names = diagramBoxNames(site, measure);
    const cut = names.get('fin')!;
    expect(cut.endsWith('…')).toBe(true);
    expect(long.startsWith(cut.slice(0, -1))).toBe(true);
    // The box is 330 units wide, the name drawn 10 in at 12 pt bold: it ends 10 short of the edge
    expect(measure(cut, 12, true)).toBeLessThanOrEqual(330 - 20);
    expect(names.get('ms')).toBe('Machine shop board');
    const all = (await pagesOf((await renderSitePackPdf(site, 'Site')).pdf)).join(' ');
    expect(all).toContain(cut);
    expect(all).toContain(`${long}, fed from`);
  }, 60_000);

  it('splits a tall diagram into pages of whole boards', () => {
    const t = threeLevel();
    for (let i = 0; i < 27; i += 1) {
      t.boards.push({
        ...t.boards[2],
        id: `c${i}`,
        name: `Bay ${i + 1} board`,
        feed: { from: 'origin' },
      } as SiteBoardInput);
    }
    const layout = layoutSite(sizeSite(t));
    const pages = diagramPages(layout.boards, pageDrawingHeight(layout.width));
    expect(pages.length).toBeGreaterThan(1);
    expect(pages.flatMap((p) => p.boards).length).toBe(30);
    for (const p of pages) {
      for (const b of p.boards) {
        expect(b.y - 46).toBeGreaterThanOrEqual(p.top);
        expect(b.y + 92).toBeLessThanOrEqual(p.bottom);
      }
      expect(p.bottom - p.top).toBeLessThanOrEqual(pageDrawingHeight(layout.width));
    }
    expect(sitePackFileName('  ')).toBe('site-pack-site.pdf');
  });

  it('prints a site of ten boards fed from one (a shallow, narrow drawing over several pages)', async () => {
    const t = threeLevel();
    // Nine more boards fed from the origin: one level, so the drawing is narrow and scaled up
    for (let i = 0; i < 9; i += 1) {
      t.boards.push({
        ...t.boards[2],
        id: `d${i}`,
        name: `Bay ${i + 1} board`,
        feed: { from: 'origin' },
      } as SiteBoardInput);
    }
    const site = sizeSite(t);
    const { pdf } = await renderSitePackPdf(site, 'Bench site', new Date('2026-12-02T12:00:00Z'));
    const pages = await pagesOf(pdf);
    expect(pages.filter((p) => p.includes('Single-line diagram')).length).toBeGreaterThan(1);
    expect(pages.join(' ')).toContain('Bay 9 board');
  }, 60_000);
});
