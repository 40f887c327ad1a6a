import { describe, expect, it } from 'vitest';

import { warmUpSite, warmUpSource } from '@/features/schedule/print/warm-up';
import { renderSchedulePdf } from '@/features/schedule/render-schedule';
import { renderSitePackPdf } from '@/features/schedule/site-pack/render-site-pack';

describe('the print warm-up board', () => {
  it('is sized without issues, every circuit passing, so that its render runs the whole schedule', async () => {
    const source = warmUpSource();
    expect(source.sizingIssues).toEqual([]);
    const verdicts = source.sizing!.ways.filter((w) => w.result).map((w) => w.result!.verdict);
    expect(verdicts).toEqual(['passes', 'passes']);
    const { pdf } = await renderSchedulePdf(source, new Date('2026-12-03T08:00:00Z'));
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
  }, 30_000);

  it('as a site of one board fed from the origin, is sized by the tree with the origin as its supply, and its site pack pages render', async () => {
    const source = warmUpSource();
    const site = warmUpSite(source);
    expect(site.boards).toHaveLength(1);
    const [board] = site.boards;
    // Fed from the origin: Zdb = Ze and no volt drop used above (the tree's rules 1 and 3)
    expect(board.zdb?.value).toBe(source.snapshot.settings.supply.zeOhm);
    expect(board.vdUsed?.value).toBe(0);
    expect(board.worstVerdict).toBe('passes');
    const { pdf } = await renderSitePackPdf(site, source.snapshot.siteName, new Date('2026-12-03T08:00:00Z'));
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
  }, 30_000);
});
